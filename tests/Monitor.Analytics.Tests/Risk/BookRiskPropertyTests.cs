using FsCheck.Xunit;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Tests.Risk;

/// <summary>
/// The book path (ledger merged by date, curve grid, dot products) against the position-by-position reference.
/// Identity tested: exposures are linear in the cash flows (primer, "Everything above is linear in the cash flows"),
/// so the book's figures equal the sum of its positions' figures.
/// </summary>
public class BookRiskPropertyTests
{
    private static readonly string?[] Keys = [null, "", "group-a", "group-b"];

    private sealed record Position(string? Key, CashFlow[] Flows, double Face);

    private static Position RandomPosition(Random rng) =>
        new(Keys[rng.Next(Keys.Length)], RiskTestData.RandomBond(rng), rng.Next(-20, 40) * 250_000.0 + 1_000.0);

    [Property(MaxTest = 30)]
    public void Book_aggregate_on_the_curve_grid_equals_the_sum_of_position_risks(int seed)
    {
        // Tolerance 1e-9 of the gross scale: both sides add the same terms in a different order, so they differ by
        // rounding of order (number of terms) x eps x (sum of |terms|), far below 1e-9 for a few hundred flows.
        var rng = new Random(seed);
        var svensson = rng.Next(2) == 0;
        var baseCurve = RiskTestData.Curve(RiskTestData.BaseParameters(rng, svensson));
        var spreads = new Dictionary<string, IFactorCurve>
        {
            ["group-a"] = RiskTestData.Curve(RiskTestData.SpreadParameters(rng)),
            ["group-b"] = RiskTestData.Curve(RiskTestData.SpreadParameters(rng)),
        };
        var dates = new CashFlowDateIndex();
        var books = new List<(BookCashFlowLedger Ledger, List<Position> Positions)>();
        for (var b = 0; b < 3; b++)
        {
            var ledger = new BookCashFlowLedger(dates);
            var positions = new List<Position>();
            for (var i = rng.Next(1, 12); i > 0; i--)
            {
                var p = RandomPosition(rng);
                positions.Add(p);
                ledger.Add(p.Key, p.Flows, p.Face / 100.0);
            }
            books.Add((ledger, positions));
        }
        var grid = CurveGrid.Build(dates, RiskTestData.ValuationDate, baseCurve, spreads);
        var results = BookRiskCalculator.ComputeAll(books.Select(b => b.Ledger).ToList(), grid, maxDegreeOfParallelism: 2);

        for (var b = 0; b < books.Count; b++)
        {
            var reference = FactorExposures.Zero(baseCurve.FactorCount, 0);
            var gross = FactorExposures.Zero(baseCurve.FactorCount, 0);
            foreach (var p in books[b].Positions)
            {
                var spread = CurveKey.IsGovernment(p.Key) ? null : spreads[p.Key!];
                var e = PositionRisk.Compute(p.Flows, RiskTestData.ValuationDate, baseCurve, spread, p.Face / 100.0);
                reference = reference.Plus(e);
                gross = gross.Plus(e.Scale(Math.Sign(p.Face)));
            }
            AssertClose(reference, results[b].Total, gross);
            // The key-major batch pass and the single-book pass run the same sums: equal, key by key.
            var single = BookRiskCalculator.Compute(books[b].Ledger, grid);
            Assert.Equal(single.ByCurveKey.Keys.Order(), results[b].ByCurveKey.Keys.Order());
            Assert.Equal(single.Total.Value, results[b].Total.Value);
            Assert.Equal(single.Total.Dv01, results[b].Total.Dv01);
        }
    }

    [Property(MaxTest = 30)]
    public void Per_curve_key_book_figures_equal_the_sum_over_that_keys_positions(int seed)
    {
        // Same linearity identity, one spread group at a time (what a group-scoped limit reads).
        var rng = new Random(seed);
        var baseCurve = RiskTestData.Curve(RiskTestData.BaseParameters(rng, svensson: false));
        var spread = RiskTestData.Curve(RiskTestData.SpreadParameters(rng));
        var dates = new CashFlowDateIndex();
        var ledger = new BookCashFlowLedger(dates);
        var reference = FactorExposures.Zero(3, 3);
        var gross = FactorExposures.Zero(3, 3);
        for (var i = 0; i < 8; i++)
        {
            var p = RandomPosition(rng) with { Key = "group-a" };
            ledger.Add(p.Key, p.Flows, p.Face / 100.0);
            var e = PositionRisk.Compute(p.Flows, RiskTestData.ValuationDate, baseCurve, spread, p.Face / 100.0);
            reference = reference.Plus(e);
            gross = gross.Plus(e.Scale(Math.Sign(p.Face)));
        }
        var grid = CurveGrid.Build(dates, RiskTestData.ValuationDate, baseCurve, new Dictionary<string, IFactorCurve> { ["group-a"] = spread });
        var risk = BookRiskCalculator.Compute(ledger, grid);
        AssertClose(reference, risk.ByCurveKey["group-a"], gross);
        Assert.False(risk.ByCurveKey.ContainsKey(CurveKey.Government));
    }

    [Property(MaxTest = 50)]
    public void Adding_then_removing_a_trade_restores_the_ledger(int seed)
    {
        // Identity: Remove(key, flows, s) = Add(key, flows, -s) is the inverse of Add (common practice, no source);
        // equal within float cancellation, 1e-9 of the larger amount (the ledger's netting tolerance), and dates the
        // trade brought in are gone again.
        var rng = new Random(seed);
        var dates = new CashFlowDateIndex();
        var ledger = new BookCashFlowLedger(dates);
        for (var i = rng.Next(0, 10); i > 0; i--)
        {
            var p = RandomPosition(rng);
            ledger.Add(p.Key, p.Flows, p.Face / 100.0);
        }
        var before = Snapshot(ledger);
        var trade = RandomPosition(rng);
        ledger.Add(trade.Key, trade.Flows, trade.Face / 100.0);
        _ = ledger.GetSegment(trade.Key); // force a compaction in between, as a risk run would
        ledger.Remove(trade.Key, trade.Flows, trade.Face / 100.0);
        var after = Snapshot(ledger);

        Assert.Equal(before.Keys.Order(), after.Keys.Order());
        foreach (var (key, flows) in before)
        {
            Assert.Equal(flows.Select(f => f.Date), after[key].Select(f => f.Date));
            for (var i = 0; i < flows.Count; i++)
            {
                var expected = flows[i].Amount;
                Assert.True(Math.Abs(after[key][i].Amount - expected) <= 1e-9 * Math.Max(Math.Abs(expected), Math.Abs(trade.Face)),
                    $"{key} {flows[i].Date}: {expected:R} became {after[key][i].Amount:R}");
            }
        }
    }

    private static Dictionary<string, IReadOnlyList<CashFlow>> Snapshot(BookCashFlowLedger ledger) =>
        ledger.CurveKeys.ToDictionary(k => k, ledger.CashFlows);

    private static void AssertClose(FactorExposures expected, FactorExposures actual, FactorExposures gross) =>
        RiskAssert.Close(expected, actual, gross);
}
