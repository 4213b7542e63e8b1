using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Tests.Risk;

public class BookCashFlowLedgerTests
{
    private static readonly DateOnly Today = RiskTestData.ValuationDate;

    [Fact]
    public void Flows_on_the_same_date_merge_and_dates_that_net_to_zero_are_dropped()
    {
        // Common practice, no source: a book's flows are merged by date; a long and an equal short cancel.
        var ledger = new BookCashFlowLedger(new CashFlowDateIndex());
        var five = RiskTestData.Bond(Today.AddYears(5), 0.04, 2);
        var three = RiskTestData.Bond(Today.AddYears(5).AddMonths(-24), 0.02, 2);
        ledger.Add(null, five, 10_000.0);
        ledger.Add("", three, 20_000.0);
        ledger.Add("group-a", five, 1_000.0);
        Assert.Equal(["", "group-a"], ledger.CurveKeys);
        // 3-year maturity date carries its redemption plus the 5-year bond's coupon.
        var date = Today.AddYears(3);
        Assert.Equal(20_000.0 * 101.0 + 10_000.0 * 2.0, ledger.AmountOn(CurveKey.Government, date), 1e-6);

        ledger.Remove(null, three, 20_000.0);
        Assert.Equal(10_000.0 * 2.0, ledger.AmountOn(null, date), 1e-6);
        ledger.Remove("group-a", five, 1_000.0);
        Assert.Equal([""], ledger.CurveKeys);
        Assert.Equal(0, ledger.GetSegment("group-a").Count);
    }

    [Fact]
    public void The_compact_view_is_ascending_and_rebuilt_after_changes()
    {
        var dates = new CashFlowDateIndex();
        var ledger = new BookCashFlowLedger(dates);
        ledger.Add(null, [new CashFlow(Today.AddYears(4), 1.0)], 1.0);
        ledger.Add(null, [new CashFlow(Today.AddYears(1), 1.0)], 1.0);
        Assert.Equal(2, ledger.GetSegment(null).Count);
        ledger.Add(null, [new CashFlow(Today.AddYears(2), 3.0)], 2.0);
        var segment = ledger.GetSegment(null);
        Assert.Equal([0, 1, 2], segment.DateIndices.ToArray());
        Assert.Equal([1.0, 1.0, 6.0], segment.Amounts.ToArray());
        Assert.Equal([Today.AddYears(1), Today.AddYears(2), Today.AddYears(4)], ledger.CashFlows(null).Select(f => f.Date));
    }

    [Fact]
    public void Bad_input_is_refused_with_the_field_named()
    {
        var ledger = new BookCashFlowLedger(new CashFlowDateIndex());
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => ledger.Add(null, [new CashFlow(Today, 1.0)], double.NaN));
        Assert.Equal("scale", ex.ParamName);
        Assert.Throws<ArgumentException>(() => ledger.Add(null, [new CashFlow(Today, double.PositiveInfinity)], 1.0));
    }

    [Fact]
    public void The_grid_refuses_a_ledger_with_dates_added_after_it_was_built_and_an_unknown_spread_group()
    {
        var dates = new CashFlowDateIndex();
        var ledger = new BookCashFlowLedger(dates);
        var curve = new NelsonSiegelCurve(0.04, -0.01, 0.01, 2.0);
        ledger.Add(null, RiskTestData.Bond(Today.AddYears(2), 0.03, 1), 1.0);
        var grid = CurveGrid.Build(dates, Today, curve);
        ledger.Add(null, RiskTestData.Bond(Today.AddYears(9), 0.03, 1), 1.0);
        Assert.Throws<InvalidOperationException>(() => BookRiskCalculator.Compute(ledger, grid));
        ledger.Add("group-x", RiskTestData.Bond(Today.AddYears(2), 0.03, 1), 1.0);
        var grid2 = CurveGrid.Build(dates, Today, curve);
        var ex = Assert.Throws<KeyNotFoundException>(() => BookRiskCalculator.Compute(ledger, grid2));
        Assert.Contains("group-x", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_empty_book_has_zero_exposures_and_paid_flows_count_for_nothing()
    {
        // Common practice, no source: flows on or before the valuation date are not part of the dirty value.
        var dates = new CashFlowDateIndex();
        var ledger = new BookCashFlowLedger(dates);
        var curve = new NelsonSiegelCurve(0.04, -0.01, 0.01, 2.0);
        Assert.Equal(0.0, BookRiskCalculator.Compute(ledger, CurveGrid.Build(dates, Today, curve)).Total.Value);
        ledger.Add(null, [new CashFlow(Today, 100.0), new CashFlow(Today.AddDays(-3), 100.0)], 1.0);
        var risk = BookRiskCalculator.Compute(ledger, CurveGrid.Build(dates, Today, curve));
        Assert.Equal(0.0, risk.Total.Value);
        Assert.Equal(0.0, risk.Total.Dv01);
    }
}
