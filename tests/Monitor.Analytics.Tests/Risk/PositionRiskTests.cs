using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Tests.Risk;

public class PositionRiskTests
{
    private static readonly DateOnly Today = RiskTestData.ValuationDate;
    private static readonly NelsonSiegelCurve Base = new(0.045, -0.015, 0.02, 2.0);
    private static readonly NelsonSiegelCurve Spread = new(0.012, 0.004, -0.003, 1.5);

    [Theory]
    [InlineData(91)]
    [InlineData(730)]
    [InlineData(3653)]
    [InlineData(10958)]
    public void A_zero_coupon_bond_has_level_duration_equal_to_its_time_to_maturity(int days)
    {
        // Fisher and Weil (1971) / Macaulay (1938): a single payment's duration is its time to payment.
        var t = days / 365.0;
        CashFlow[] zero = [new(Today.AddDays(days), 100.0)];
        var e = PositionRisk.Compute(zero, Today, Base);
        Assert.Equal(t, e.BaseDuration(0), 1e-12 * t);
        // Convexity of a single payment: t^2 (primer formula with one cash flow).
        Assert.Equal(t * t, e.BaseConvexity(0), 1e-12 * t * t);
    }

    [Theory]
    [InlineData(91)]
    [InlineData(1826)]
    [InlineData(10958)]
    public void A_zero_coupon_bond_has_slope_duration_t_L1_and_curvature_duration_t_L2(int days)
    {
        // Primer: D_k = sum c t L_k DF / P reduces to t L_k(t) for one payment; L1, L2 from Nelson and Siegel (1987),
        // written out here in closed form: L1 = (1 - e^-x)/x, L2 = L1 - e^-x, x = t / tau.
        var t = days / 365.0;
        var x = t / Base.Tau;
        var l1 = (1 - Math.Exp(-x)) / x;
        var l2 = l1 - Math.Exp(-x);
        var e = PositionRisk.Compute([new CashFlow(Today.AddDays(days), 100.0)], Today, Base);
        Assert.Equal(t * l1, e.BaseDuration(1), 1e-11 * t);
        Assert.Equal(t * l2, e.BaseDuration(2), 1e-11 * t);
        Assert.Equal(t * t * l1 * l2, e.BaseCrossConvexity(1, 2), 1e-11 * t * t);
    }

    [Fact]
    public void A_spread_bond_has_spread_level_duration_equal_to_its_base_level_duration()
    {
        // Primer, "Spread curves": DF = exp(-(z_b + s) t) and both level loadings are 1, so dP/db0 = dP/dg0.
        var flows = RiskTestData.Bond(Today.AddYears(7), 0.05, 2);
        var e = PositionRisk.Compute(flows, Today, Base, Spread);
        Assert.Equal(3, e.SpreadFactorCount);
        Assert.Equal(e.BaseDuration(0), e.SpreadDuration(0), 1e-14 * e.BaseDuration(0));
        Assert.Equal(e.BaseConvexity(0), e.SpreadConvexity(0), 1e-14 * e.BaseConvexity(0));
        Assert.Equal(e.BaseConvexity(0), e.BaseSpreadCrossConvexity(0, 0), 1e-14 * e.BaseConvexity(0));
        Assert.True(e.SpreadDuration(1) > 0 && e.SpreadDuration(2) > 0);
    }

    [Fact]
    public void A_government_bond_has_zero_spread_figures()
    {
        // Common practice, no source: a bond discounted on the base curve alone has no spread exposure.
        var e = PositionRisk.Compute(RiskTestData.Bond(Today.AddYears(5), 0.03, 2), Today, Base);
        Assert.Equal(0, e.SpreadFactorCount);
        Assert.Equal(0.0, e.SpreadDuration(0));
        Assert.Equal(0.0, e.SpreadMoneyPerBp(2));
        Assert.Equal(0.0, e.SpreadConvexity(1));
    }

    [Fact]
    public void A_short_position_has_negative_money_figures_and_positive_unit_durations()
    {
        // Sign convention (FactorExposures docs; common practice, no source): money per bp is the value lost when a
        // factor rises 1 bp, so a long loses (positive) and a short gains (negative); D_k = money / P keeps its sign.
        var flows = RiskTestData.Bond(Today.AddYears(10), 0.04, 2);
        var longPosition = PositionRisk.Compute(flows, Today, Base, Spread, scale: 50_000.0);
        var shortPosition = PositionRisk.Compute(flows, Today, Base, Spread, scale: -50_000.0);
        Assert.True(longPosition.Value > 0 && longPosition.Dv01 > 0 && longPosition.BaseMoneyPerBp(1) > 0 && longPosition.SpreadMoneyPerBp(0) > 0);
        Assert.True(shortPosition.Value < 0);
        Assert.True(shortPosition.Dv01 < 0);
        for (var k = 0; k < 3; k++)
        {
            Assert.True(shortPosition.BaseMoneyPerBp(k) < 0);
            Assert.True(shortPosition.SpreadMoneyPerBp(k) < 0);
            Assert.Equal(longPosition.BaseDuration(k), shortPosition.BaseDuration(k), 1e-12);
            Assert.Equal(-longPosition.BaseMoneyPerBp(k), shortPosition.BaseMoneyPerBp(k), 1e-9);
        }
        // Money per bp = D P 1e-4 (primer, "Dollar form per bp").
        Assert.Equal(longPosition.BaseDuration(0) * longPosition.Value * 1e-4, longPosition.Dv01, 1e-9 * longPosition.Dv01);
    }

    [Fact]
    public void Flows_on_or_before_the_valuation_date_are_ignored()
    {
        // Common practice, no source: a flow paid on or before the valuation date is not part of the dirty value.
        CashFlow[] flows = [new(Today, 5.0), new(Today.AddDays(-10), 5.0), new(Today.AddYears(2), 105.0)];
        var all = PositionRisk.Compute(flows, Today, Base);
        var future = PositionRisk.Compute([flows[2]], Today, Base);
        Assert.Equal(future.Value, all.Value);
        Assert.Equal(future.BaseDuration(0), all.BaseDuration(0));
    }

    [Fact]
    public void A_Svensson_base_curve_has_four_factors_and_a_spread_curve_adds_its_own()
    {
        // Svensson (1994): four linear factors; the fourth loading is the second hump C(t / tau2).
        var svensson = new SvenssonCurve(0.04, -0.01, 0.01, 0.02, 1.5, 8.0);
        var t = 4000 / 365.0;
        var e = PositionRisk.Compute([new CashFlow(Today.AddDays(4000), 100.0)], Today, svensson, Spread);
        Assert.Equal(4, e.BaseFactorCount);
        Assert.Equal(3, e.SpreadFactorCount);
        Assert.Equal(t * NelsonSiegelLoadings.Curvature(t / 8.0), e.BaseDuration(3), 1e-12 * t);
        Assert.Throws<ArgumentOutOfRangeException>(() => e.BaseDuration(4));
    }

    [Fact]
    public void Unit_forms_are_not_a_number_when_the_value_is_zero()
    {
        // Documented behaviour: a fully hedged book has no value to weight by; money forms stay usable.
        var flows = RiskTestData.Bond(Today.AddYears(3), 0.02, 1);
        var hedged = PositionRisk.Compute(flows, Today, Base).Plus(PositionRisk.Compute(flows, Today, Base, scale: -1.0));
        Assert.Equal(0.0, hedged.Value);
        Assert.True(double.IsNaN(hedged.BaseDuration(0)));
        Assert.Equal(0.0, hedged.Dv01);
    }
}
