using MassTransit.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Time.Testing;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Issue "Nothing lost, nothing double-counted": a service started again on the same folders rebuilds its books from
/// the start-of-day files plus the trade journal, counts a redelivered trade once, and continues the exposure log's
/// hash chain where it stopped.
/// </summary>
public class RestartRecoveryTests
{
    [Fact]
    public async Task A_restarted_service_has_the_same_books_and_counts_a_redelivery_once()
    {
        using var root = new TempFolder();
        Snapshot before;
        long lastSeq;
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            await first.TradeAsync(ServiceUnderTest.Trade("R-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000));
            await first.TradeAsync(ServiceUnderTest.Trade("R-1", 2, "amend", "RATES-CORE", "VGB-2031-05", 8_000_000));
            await first.TradeAsync(ServiceUnderTest.Trade("R-2", 1, "new", "RATES-CURVE", "VGB-2051-11", -3_000_000));
            before = await Snapshot.OfAsync(first);
            lastSeq = first.VerifyLog().LastSeq ?? 0;
        }

        await using var second = await ServiceUnderTest.StartAsync(root: root.Path);
        before.AssertSame(await Snapshot.OfAsync(second));

        // The broker redelivers the last trade after the restart: it changes nothing.
        await second.TradeAsync(ServiceUnderTest.Trade("R-2", 1, "new", "RATES-CURVE", "VGB-2051-11", -3_000_000));
        before.AssertSame(await Snapshot.OfAsync(second));

        var log = ExposureLogVerifier.VerifyFolder(TestKey.Value, second.LogFolder);
        Assert.True(log.Intact, string.Join("; ", log.Problems));
        Assert.True(log.LastSeq > lastSeq, "the second run appends to the same chain");
    }

    [Fact]
    public async Task The_replay_refit_is_logged_and_published_as_journal_replay()
    {
        using var root = new TempFolder();
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            await first.TradeAsync(ServiceUnderTest.Trade("R-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000));
        }

        await using var second = await ServiceUnderTest.StartAsync(root: root.Path);
        await second.Pipeline.WhenPublishedAsync();
        var replay = second.Services.GetRequiredService<EngineRecovery>().Result.Refit;
        var replayRecords = File.ReadAllLines(Directory.GetFiles(second.LogFolder, "*.jsonl").Single())
            .Where(l => l.Contains("\"journal-replay\"", StringComparison.Ordinal)).ToArray();

        // The journalled quotes refit the curves before the pipeline runs; each status the refit moved has its record and event.
        Assert.NotEmpty(replay.Curves);
        Assert.Equal(replay.Curves.Count, replayRecords.Count(l => l.Contains("\"kind\":\"curve-", StringComparison.Ordinal)));
        Assert.Equal(replay.StatusChanges.Count, replayRecords.Count(l => l.Contains("\"kind\":\"status-change\"", StringComparison.Ordinal)));
        Assert.Equal(replay.StatusChanges.Count, second.Harness.Published.Select<Monitor.Contracts.V1.LimitStatusChanged>().Count(m => m.Context.Message.CauseMessageType == "journal-replay"));
        Assert.True(second.VerifyLog().Intact);
    }

    [Fact]
    public async Task A_journalled_trade_missing_from_the_exposure_log_is_recorded_at_start()
    {
        // A kill between the journal's fsync and the log write: the trade is durable, its audit record is not.
        using var root = new TempFolder();
        var trade = new TradeInput("J-1", 1, TradeAction.New, "RATES-CORE", "VGB-2031-05", 2_000_000, 99.5, TestMarket.Now.AddMinutes(-2));
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = Path.Combine(root.Path, "exposure-log-journal") }, new FakeTimeProvider(TestMarket.Now)))
        {
            await journal.AppendTradeAsync(trade);
        }

        await using var service = await ServiceUnderTest.StartAsync(root: root.Path);
        Assert.Equal(1, await service.Pipeline.ReadAsync(e => e.Trades.Count));
        var records = File.ReadAllLines(Directory.GetFiles(service.LogFolder, "*.jsonl").Single())
            .Where(l => l.Contains("\"kind\":\"trade-applied\"", StringComparison.Ordinal)).ToArray();
        var record = Assert.Single(records);
        Assert.Contains("\"journal-replay\"", record, StringComparison.Ordinal);
        Assert.Contains("\"tradeId\":\"J-1\"", record, StringComparison.Ordinal);
        Assert.True(service.VerifyLog().Intact);
    }

    /// <summary>Positions (exact), trade count (exact) and book figures (to 1e-6 relative: the restarted curves are refitted cold from the journalled quotes and stop within the fit tolerance of the warm-started ones).</summary>
    private sealed record Snapshot(string Positions, int Trades, Dictionary<string, double> Figures)
    {
        public static Task<Snapshot> OfAsync(ServiceUnderTest service) => service.Pipeline.ReadAsync(e => new Snapshot(
            string.Join("; ", e.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal)
                .Select(b => $"{b.Id} [{string.Join(",", b.Positions.OrderBy(p => p.Key, StringComparer.Ordinal).Select(p => $"{p.Key}={p.Value:R}"))}]")),
            e.Trades.Count,
            e.Books.Values.Where(b => b.Exposures is not null)
                .SelectMany(b => b.Exposures!.Totals.Select(t => ($"{b.Id}.{t.Key}", t.Value)))
                .ToDictionary(p => p.Item1, p => p.Value, StringComparer.Ordinal)));

        public void AssertSame(Snapshot other)
        {
            Assert.Equal(Positions, other.Positions);
            Assert.Equal(Trades, other.Trades);
            Assert.Equal(Figures.Keys.Order(StringComparer.Ordinal), other.Figures.Keys.Order(StringComparer.Ordinal));
            foreach (var (key, value) in Figures)
            {
                Assert.True(Math.Abs(value - other.Figures[key]) <= 1e-6 * Math.Max(1, Math.Abs(value)), $"{key}: {value} vs {other.Figures[key]}");
            }
        }
    }
}
