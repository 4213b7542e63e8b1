using Monitor.Analytics.Market;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Journal.JournalTestEngine;

namespace Monitor.Service.Tests.Journal;

/// <summary>Writing and reading back the journal (format trade-journal/2, src/Monitor.Service/Journal/README.md).</summary>
public sealed class TradeJournalTests
{
    private static readonly DateOnly Day = new(2026, 6, 1);

    [Fact]
    public async Task Trades_and_quotes_round_trip_in_order_with_the_latest_quote_per_instrument()
    {
        using var folder = new TempFolder();
        var trades = new[]
        {
            Trade("T-1", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1_000_000, 99.125),
            Trade("T-2", 1, TradeAction.New, "CREDIT-IG", "QFU-2029-03", -2_500_000.5, 101.0 / 3.0),
            Trade("T-1", 2, TradeAction.Amend, "RATES-CURVE", "VGB-2030-08", 1_500_000, 99.25),
            Trade("T-1", 3, TradeAction.Cancel, "RATES-CURVE", "VGB-2030-08", 1_500_000, 99.25),
        };
        var q1 = new BondQuote("VGB-2030-08", Now.AddMinutes(-30), 98.1, 98.2, null, null, "feed-a");
        var q2 = new BondQuote("VGB-2030-08", Now.AddMinutes(-10), null, null, 98.3, null, "feed-a");
        var q3 = new BondQuote("VGB-2030-08", Now.AddMinutes(-20), null, null, 97.0, null, "feed-b"); // older, arrives last: not kept
        var q4 = new BondQuote("QFU-2029-03", new DateTimeOffset(2026, 6, 1, 18, 0, 0, TimeSpan.FromHours(2)), null, null, null, 0.0412, null);
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now)))
        {
            journal.AppendQuote(q1);
            await journal.AppendTradeAsync(trades[0]);
            await journal.AppendTradeAsync(trades[1]);
            journal.AppendQuote(q2);
            journal.AppendQuote(q3);
            journal.AppendQuote(q4);
            await journal.AppendTradeAsync(trades[2]);
            await journal.AppendTradeAsync(trades[3]);
            Assert.True(journal.IsHealthy);
        }

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Empty(contents.Problems);
        Assert.Equal(trades, contents.Trades); // record equality: the whole payload, version and action included
        Assert.Equal(8, contents.LastSeq);
        Assert.Equal(2, contents.LatestQuotes.Count);
        Assert.Equal(q2, contents.LatestQuotes["VGB-2030-08"]);
        Assert.Equal(q4, contents.LatestQuotes["QFU-2029-03"]);
        Assert.Equal(q4.QuoteTime.Offset, contents.LatestQuotes["QFU-2029-03"].QuoteTime.Offset);
    }

    [Fact]
    public async Task A_restarted_journal_continues_the_sequence_of_the_day_file()
    {
        using var folder = new TempFolder();
        var options = new JournalOptions { Folder = folder.Path };
        await using (var first = new TradeJournal(TestKey.Value, options, new ManualClock(Now)))
        {
            await first.AppendTradeAsync(Trade("T-1", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1e6));
            await first.AppendTradeAsync(Trade("T-2", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 2e6));
        }
        await using (var second = new TradeJournal(TestKey.Value, options, new ManualClock(Now.AddMinutes(1))))
        {
            await second.AppendTradeAsync(Trade("T-3", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 3e6));
        }

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Empty(contents.Problems);
        Assert.Equal(3, contents.LastSeq);
        Assert.Equal(["T-1", "T-2", "T-3"], contents.Trades.Select(t => t.TradeId));
    }

    [Fact]
    public async Task The_business_day_roll_picks_the_day_file()
    {
        using var folder = new TempFolder();
        // 02:00Z on 1 June is 22:00 on 31 May in New York (EDT, UTC-4): before a 23:00 roll, so business day 31 May.
        var clock = new ManualClock(new DateTimeOffset(2026, 6, 1, 2, 0, 0, TimeSpan.Zero));
        var roll = new BusinessDayRoll(new TimeOnly(23, 0), TimeZoneInfo.FindSystemTimeZoneById("America/New_York"));
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, clock, roll))
        {
            await journal.AppendTradeAsync(Trade("T-1", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1e6));
        }

        Assert.Single(JournalReplay.Read(TestKey.Value, folder.Path, new DateOnly(2026, 5, 31)).Trades);
        Assert.False(File.Exists(JournalFiles.PathOf(folder.Path, Day)));
    }

    [Fact]
    public async Task Concurrent_appends_all_complete_share_fsyncs_and_keep_each_callers_order()
    {
        using var folder = new TempFolder();
        const int callers = 16;
        const int perCaller = 100;
        long flushes;
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now)))
        {
            var tasks = Enumerable.Range(0, callers).Select(c => Task.Run(async () =>
            {
                for (var i = 0; i < perCaller; i++)
                {
                    // Each caller waits for its own record before the next, as a consumer waits before its ack.
                    await journal.AppendTradeAsync(Trade($"C{c}-{i}", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1e6 + i));
                }
            })).ToArray();
            await Task.WhenAll(tasks);
            flushes = journal.FlushCount;
            Assert.Equal(callers * perCaller, journal.RecordCount);
        }

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Empty(contents.Problems);
        Assert.Equal(callers * perCaller, contents.Trades.Count);
        Assert.Equal(callers * perCaller, contents.LastSeq);
        for (var c = 0; c < callers; c++)
        {
            var mine = contents.Trades.Where(t => t.TradeId.StartsWith($"C{c}-", StringComparison.Ordinal)).Select(t => t.TradeId).ToArray();
            Assert.Equal(Enumerable.Range(0, perCaller).Select(i => $"C{c}-{i}"), mine);
        }
        // Group commit: 16 callers waiting at once share fsyncs, so there are fewer flushes than records.
        Assert.True(flushes < callers * perCaller, $"{flushes} flushes for {callers * perCaller} appends: no batching");
    }

    [Fact]
    public async Task Appends_queued_together_are_written_in_call_order()
    {
        using var folder = new TempFolder();
        const int count = 1000;
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path, MaxBatch = 64 }, new ManualClock(Now)))
        {
            var pending = new List<Task>(count);
            for (var i = 0; i < count; i++)
            {
                pending.Add(journal.AppendTradeAsync(Trade($"T-{i}", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1e6)).AsTask());
            }
            await Task.WhenAll(pending);
            Assert.True(journal.FlushCount < count);
        }

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Equal(Enumerable.Range(0, count).Select(i => $"T-{i}"), contents.Trades.Select(t => t.TradeId));
    }
}
