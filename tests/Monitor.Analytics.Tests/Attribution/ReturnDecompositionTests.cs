using Monitor.Analytics.Attribution;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;
using Monitor.Analytics.Tests.Risk;

namespace Monitor.Analytics.Tests.Attribution;

public class ReturnDecompositionTests
{
    private static readonly DateOnly T0 = RiskTestData.ValuationDate;
    private static readonly DateOnly T1 = T0.AddDays(30);
    private static readonly NelsonSiegelCurve Base0 = new(0.045, -0.015, 0.02, 2.0);
    private static readonly NelsonSiegelCurve Spread0 = new(0.012, 0.004, -0.003, 1.5);

    [Fact]
    public void A_zero_on_a_flat_curve_earns_the_yield_over_the_horizon()
    {
        // Continuous compounding: 100 e^{-y (T - dt)} / (100 e^{-y T}) = e^{y dt}, so ln(Vh/V0) = y dt
        // (J. Hull, Options, Futures, and Other Derivatives, chapter "Interest rates", from memory).
        const double y = 0.037;
        var flat = new NelsonSiegelCurve(y, 0, 0, 2.0);
        var r = ReturnDecomposition.Decompose([new CashFlow(T0.AddYears(6), 100.0)], T0, T1, flat, flat);
        Assert.Equal(y * 30 / 365.0, r.Contributions[0].Return, 1e-14);
        Assert.Equal(0.0, r.Contributions[1].Return);
        Assert.Equal(0.0, r.Contributions[2].Return);
        Assert.Equal(0.0, r.Contributions[3].Return);
    }

    [Fact]
    public void The_horizon_return_of_a_zero_is_carry_plus_roll_down_on_the_unchanged_curve()
    {
        // Primer: Vh is the value at t1 on the t0 curve (as a function of time to payment), so for a zero maturing
        // at T: ln(Vh/V0) = z(T) T - z(T - dt) (T - dt).
        var maturity = T0.AddYears(4);
        var T = CurveTime.YearsBetween(T0, maturity);
        var tLeft = CurveTime.YearsBetween(T1, maturity);
        var expected = Base0.ZeroRate(T) * T - Base0.ZeroRate(tLeft) * tLeft;
        var r = ReturnDecomposition.Decompose([new CashFlow(maturity, 100.0)], T0, T1, Base0, Base0);
        Assert.Equal(expected, r.Contributions[0].Return, 1e-13);
    }

    [Fact]
    public void A_coupon_paid_within_the_period_counts_as_cash_in_every_later_value()
    {
        // Our documented treatment (common practice, no source): received at face, no reinvestment interest.
        CashFlow[] flows = [new(T0, 2.5), new(T0.AddDays(10), 2.5), new(T0.AddDays(191), 102.5)];
        var moved = new NelsonSiegelCurve(0.047, -0.015, 0.02, 2.0);
        var r = ReturnDecomposition.Decompose(flows, T0, T1, Base0, moved);
        Assert.Equal(2.5, r.ReceivedCash);
        var t0Years = CurveTime.YearsBetween(T0, flows[1].Date);
        var t1Years = CurveTime.YearsBetween(T1, flows[2].Date);
        var t2Years = CurveTime.YearsBetween(T0, flows[2].Date);
        Assert.Equal(2.5 * Base0.Discount(t0Years) + 102.5 * Base0.Discount(t2Years), r.V0, 1e-12);
        Assert.Equal(2.5 + 102.5 * Base0.Discount(t1Years), r.Vh, 1e-12);
        Assert.Equal(2.5 + 102.5 * moved.Discount(t1Years), r.V1, 1e-12);
    }

    [Fact]
    public void A_level_rise_is_explained_mostly_by_the_level_duration_term_with_a_loss_for_a_long()
    {
        // Primer: "Level terms dominate"; sign convention: a rise of the level costs a long position.
        var flows = RiskTestData.Bond(T0.AddYears(10), 0.04, 2);
        var base1 = new NelsonSiegelCurve(0.046, -0.015, 0.02, 2.0);
        var r = ReturnDecomposition.Decompose(flows, T0, T1, Base0, base1, Spread0, Spread0);
        var e = r.BaseExplanation;
        Assert.True(e.Actual.Return < 0);
        Assert.Equal("base level duration", e.Terms[0].Name);
        Assert.True(e.Terms[0].Return < 0);
        Assert.Equal(0.0, e.Terms[1].Return); // slope did not move
        Assert.True(Math.Abs(e.Terms[0].Return) > 0.9 * Math.Abs(e.Actual.Return));
        Assert.Equal(0.0, e.Shape.Return);
        Assert.Equal(0.0, r.Contributions[2].Return); // spread unchanged
        Assert.NotNull(r.SpreadExplanation);
        Assert.All(r.SpreadExplanation!.Terms, t => Assert.Equal(0.0, t.Money));
        Assert.Equal([0.001, 0.0, 0.0], e.FactorMoves.Select(m => Math.Round(m, 12)));
    }

    [Fact]
    public void A_government_bond_has_no_spread_or_interaction_return()
    {
        // Primer: Vs = Vh when there is no spread curve, so ln(Vs/Vh) = 0 and ln(V1 Vh / (Vb Vs)) = ln(V1/Vb) = 0.
        var base1 = new NelsonSiegelCurve(0.043, -0.012, 0.025, 2.2);
        var r = ReturnDecomposition.Decompose(RiskTestData.Bond(T0.AddYears(5), 0.03, 2), T0, T1, Base0, base1);
        Assert.Null(r.SpreadExplanation);
        Assert.Equal(0.0, r.Contributions[2].Return);
        Assert.Equal(0.0, r.Contributions[3].Return, 1e-15);
        Assert.NotEqual(0.0, r.BaseExplanation.Shape.Return); // tau moved 2.0 -> 2.2
    }

    [Fact]
    public void A_book_ledger_decomposes_as_the_sum_of_its_spread_groups()
    {
        // Linearity (primer): values of a book are sums over its flows; each group uses its own spread curves.
        var dates = new CashFlowDateIndex();
        var ledger = new BookCashFlowLedger(dates);
        var gov = RiskTestData.Bond(T0.AddYears(8), 0.03, 2);
        var credit = RiskTestData.Bond(T0.AddYears(4), 0.06, 4);
        ledger.Add(null, gov, 2_000.0);
        ledger.Add("group-a", credit, 5_000.0);
        var base1 = new NelsonSiegelCurve(0.044, -0.016, 0.021, 2.0);
        var spread1 = new NelsonSiegelCurve(0.014, 0.003, -0.002, 1.5);
        var book = ReturnDecomposition.Decompose(ledger, T0, T1, Base0, base1,
            new Dictionary<string, IFactorCurve> { ["group-a"] = Spread0 }, new Dictionary<string, IFactorCurve> { ["group-a"] = spread1 });
        var g = ReturnDecomposition.Decompose([.. gov.Select(f => f with { Amount = f.Amount * 2_000.0 })], T0, T1, Base0, base1);
        var c = ReturnDecomposition.Decompose([.. credit.Select(f => f with { Amount = f.Amount * 5_000.0 })], T0, T1, Base0, base1, Spread0, spread1);
        Assert.Equal(g.V0 + c.V0, book.V0, 1e-9 * book.V0);
        Assert.Equal(g.V1 + c.V1, book.V1, 1e-9 * book.V1);
        Assert.Equal(g.Vb + c.Vb, book.Vb, 1e-9 * book.V1);
        Assert.Equal(c.SpreadExplanation!.Terms[0].Money, book.SpreadExplanation!.Terms[0].Money, 1e-9 * book.V1);
        Assert.Throws<ArgumentException>(() => ReturnDecomposition.Decompose(ledger, T0, T1, Base0, base1));
    }

    [Fact]
    public void Bad_input_is_refused_with_the_field_named()
    {
        var flows = RiskTestData.Bond(T0.AddYears(3), 0.03, 2);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => ReturnDecomposition.Decompose(flows, T1, T0, Base0, Base0));
        Assert.Equal("t1", ex.ParamName);
        Assert.Throws<ArgumentException>(() => ReturnDecomposition.Decompose(flows, T0, T1, Base0, Base0, Spread0, null));
        var svensson = new SvenssonCurve(0.04, -0.01, 0.01, 0.0, 2.0, 8.0);
        var modelChange = Assert.Throws<ArgumentException>(() => ReturnDecomposition.Decompose(flows, T0, T1, Base0, svensson));
        Assert.Equal("base1", modelChange.ParamName);
    }
}
