using System.Globalization;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Journal.JournalTestEngine;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// A restart rebuilds the book from the start-of-day files plus the journal: the result must equal the engine
/// that applied the same messages directly (nothing lost, nothing counted twice).
/// </summary>
public sealed class JournalRecoveryTests
{
    private static readonly DateOnly Day = new(2026, 6, 1);

    /// <summary>A day of trades: new, amend (also moving book), cancel, a redelivery and a late older version.</summary>
    private static readonly TradeInput[] Stream =
    [
        Trade("R-1", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 5_000_000, 98.5),
        Trade("R-2", 1, TradeAction.New, "RATES-CURVE", "VGB-2041-05", -3_000_000, 95.0),
        Trade("C-1", 1, TradeAction.New, "CREDIT-IG", "BHS-2028-12", 2_000_000, 99.0),
        Trade("R-1", 2, TradeAction.Amend, "RATES-CURVE", "VGB-2030-08", 7_000_000, 98.6),
        Trade("R-1", 2, TradeAction.Amend, "RATES-CURVE", "VGB-2030-08", 7_000_000, 98.6), // redelivery
        Trade("R-2", 2, TradeAction.Cancel, "RATES-CURVE", "VGB-2041-05", -3_000_000, 95.0),
        Trade("R-1", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 5_000_000, 98.5), // older version, late
        Trade("C-2", 1, TradeAction.New, "CREDIT-IG", "KWS-2030-09", -1_000_000, 100.2),
    ];

    [Fact]
    public async Task Rebuilding_from_the_journal_equals_applying_the_messages_directly()
    {
        using var folder = new TempFolder();
        var direct = Create();
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now)))
        {
            foreach (var trade in Stream)
            {
                var outcome = direct.ApplyTrade(trade, Now).Trade;
                if (outcome is TradeOutcome.Applied or TradeOutcome.Duplicate)
                {
                    await journal.AppendTradeAsync(trade); // the wiring journals redeliveries too (see README.md)
                }
            }
            foreach (var quote in CloseQuotes())
            {
                direct.AcceptQuote(quote, Now);
                journal.AppendQuote(quote);
            }
        }
        direct.RefitDirtyCurves(Now);

        var rebuilt = Create();
        var result = JournalRecovery.Rebuild(rebuilt, JournalReplay.Read(TestKey.Value, folder.Path, Day), Now);

        Assert.Equal(6, result.Applied); // R-1 v1, R-2 v1, C-1, R-1 v2, R-2 v2 (cancel), C-2
        Assert.Equal(1, result.Duplicates);
        Assert.Empty(result.RejectedQuotes);
        Assert.Equal(CloseQuotes().Count, result.QuotesAccepted);
        Assert.Contains(result.Refit.Curves, c => c.Accepted);
        Assert.NotNull(rebuilt.Books["RATES-CORE"].Exposures);
        Assert.NotNull(rebuilt.Books["RATES-CURVE"].Exposures);
        AssertSameBooks(direct, rebuilt);
    }

    [Fact]
    public async Task Replaying_the_journal_twice_changes_nothing_the_second_time()
    {
        using var folder = new TempFolder();
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now)))
        {
            foreach (var trade in Stream.Take(4))
            {
                await journal.AppendTradeAsync(trade);
            }
        }
        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);
        var engine = Create();
        JournalRecovery.Rebuild(engine, contents, Now);
        var once = Fingerprint(engine);

        var again = JournalRecovery.Rebuild(engine, contents, Now);

        Assert.Equal(0, again.Applied);
        Assert.Equal(3, again.Duplicates); // R-2 v1, C-1 and R-1 v2 are in the register already
        Assert.Equal(1, again.Superseded); // R-1 v1 is older than the applied v2
        Assert.Equal(once, Fingerprint(engine));
    }

    private static void AssertSameBooks(RiskEngine expected, RiskEngine actual)
    {
        Assert.Equal(expected.Books.Keys.Order(StringComparer.Ordinal), actual.Books.Keys.Order(StringComparer.Ordinal));
        foreach (var (id, book) in expected.Books)
        {
            var other = actual.Books[id];
            Assert.Equal(book.Positions.OrderBy(p => p.Key, StringComparer.Ordinal), other.Positions.OrderBy(p => p.Key, StringComparer.Ordinal));
            Assert.Equal(book.Exposures is null, other.Exposures is null); // CREDIT-IG waits for its UTIL-A curve in both
            if (book.Exposures is null)
            {
                continue;
            }
            foreach (var (measure, value) in book.Exposures!.Totals)
            {
                // Same inputs in the same order: equal to rounding noise (1e-9 relative, common practice, no source).
                Assert.Equal(value, other.Exposures!.Totals[measure], Math.Max(1e-9 * Math.Abs(value), 1e-9));
            }
        }
        foreach (var trade in Stream)
        {
            Assert.Equal(expected.Trades.Latest(trade.TradeId), actual.Trades.Latest(trade.TradeId));
        }
        Assert.Equal(expected.Trades.Count, actual.Trades.Count);
    }

    private static string Fingerprint(RiskEngine engine) => string.Join(";", engine.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal)
        .Select(b => b.Id + ":" + string.Join(",", b.Positions.OrderBy(p => p.Key, StringComparer.Ordinal)
            .Select(p => p.Key + "=" + p.Value.ToString("R", CultureInfo.InvariantCulture)))));
}
