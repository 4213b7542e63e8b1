using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Pricing;
using Monitor.Analytics.Tests.Support;
using static Monitor.Analytics.Tests.Support.D;

namespace Monitor.Analytics.Tests.Pricing;

public class CurvePricingTests
{
    private static readonly double[] HullTimes = [0.5, 1.0, 1.5, 2.0, 2.5, 3.0];
    private static readonly double[] HullAmounts = [5, 5, 5, 5, 5, 105];

    [Fact]
    public void Hull_three_year_bond_price_and_duration()
    {
        // J. Hull, Options, Futures, and Other Derivatives, chapter "Interest Rates", section "Duration": 3-year bond,
        // 10% coupon paid semiannually, yield 12% continuously compounded: price 94.213, duration 2.653 years; a 0.1%
        // yield rise lowers the price to 93.963. Figures from memory (domain primer), confirmed here: on a flat
        // continuously compounded curve the effective (parallel-shift) duration is Hull's duration.
        var curve = new FlatCurve(0.12);
        var risk = CurvePricing.Effective(HullTimes, HullAmounts, curve);
        Assert.Equal(94.213, risk.DirtyPrice, 3);
        Assert.Equal(2.653, risk.Duration, 3);
        Assert.Equal(93.963, CurvePricing.PresentValue(HullTimes, HullAmounts, new FlatCurve(0.121)), 3);
        Assert.Equal(93.963, CurvePricing.PresentValue(HullTimes, HullAmounts, new ParallelShiftedCurve(curve, 0.001)), 3);
    }

    [Fact]
    public void Effective_measures_match_the_analytic_Fisher_Weil_figures_on_a_flat_curve()
    {
        // Domain primer: level (Fisher-Weil) duration sum(t c DF)/P and convexity sum(t^2 c DF)/P; the central
        // difference of the duration differs by delta^2 M3 / 6 with M3 = sum(t^3 PV)/P ~ 700 here, i.e. ~1.2e-6,
        // hence 5 decimals on duration.
        var bond = TestBonds.Fixed(0.045m, Ymd(2020, 3, 1), Ymd(2034, 3, 1));
        var valuation = Ymd(2024, 6, 11);
        var curve = new FlatCurve(0.041);
        var flows = bond.CashFlowsAfter(valuation);
        double p = 0, tw = 0, t2w = 0;
        foreach (var f in flows)
        {
            var t = CurveTime.YearsBetween(valuation, f.Date);
            var pv = f.Amount * Math.Exp(-0.041 * t);
            p += pv;
            tw += t * pv;
            t2w += t * t * pv;
        }

        var risk = CurvePricing.Effective(bond, curve, valuation, valuation);
        Assert.Equal(p, risk.DirtyPrice, 10);
        Assert.Equal(tw / p, risk.Duration, 5);
        Assert.Equal(t2w / p, risk.Convexity, 4);
    }

    [Fact]
    public void Dirty_price_for_a_later_settlement_is_the_forward_value()
    {
        // Carry: value at settlement = PV / DF(t_settlement) (no-arbitrage forward price; common practice, no source).
        var bond = TestBonds.Fixed(0.03m, Ymd(2020, 3, 1), Ymd(2030, 3, 1));
        var curve = new FlatCurve(0.035);
        var valuation = Ymd(2024, 6, 10);
        var settlement = Ymd(2024, 6, 11);
        var pv = CurvePricing.PresentValue(bond.CashFlowsAfter(settlement), curve, valuation);
        Assert.Equal(pv * Math.Exp(0.035 / 365), CurvePricing.DirtyPrice(bond, curve, valuation, settlement), 10);
    }

    [Fact]
    public void Parallel_shifted_curve_adds_the_shift_everywhere()
    {
        var curve = new ParallelShiftedCurve(new FlatCurve(0.02), 0.005);
        Assert.Equal(0.025, curve.ZeroRate(7.0), 15);
        Assert.Equal(Math.Exp(-0.025 * 7.0), curve.Discount(7.0), 15);
        Assert.Equal(0.025, curve.InstantaneousForward(3.0), 15);
        Assert.Throws<ArgumentOutOfRangeException>(() => new ParallelShiftedCurve(curve, double.NaN));
    }

    [Fact]
    public void Bad_shift_is_rejected_naming_the_value()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => CurvePricing.Effective(HullTimes, HullAmounts, new FlatCurve(0.05), -1e-4));
        Assert.Contains("shift = -0.0001", ex.Message, StringComparison.Ordinal);
    }
}
