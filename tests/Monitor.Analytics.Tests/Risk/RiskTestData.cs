using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Tests.Risk;

/// <summary>Invented bonds and curves for the risk and attribution tests, drawn from a seeded generator.</summary>
internal static class RiskTestData
{
    public static readonly DateOnly ValuationDate = new(2026, 3, 16);

    /// <summary>
    /// Cash flows per 100 face of a fixed-coupon bond: coupons of rate/frequency stepping back from maturity
    /// (frequency 0 = zero coupon), 100 at maturity. Dates before the valuation date are included on purpose.
    /// </summary>
    public static CashFlow[] Bond(DateOnly maturity, double couponRate, int frequency)
    {
        var flows = new List<CashFlow> { new(maturity, 100.0 + (frequency == 0 ? 0.0 : 100.0 * couponRate / frequency)) };
        if (frequency > 0)
        {
            var months = 12 / frequency;
            for (var d = maturity.AddMonths(-months); d > ValuationDate.AddYears(-1); d = d.AddMonths(-months))
            {
                flows.Add(new CashFlow(d, 100.0 * couponRate / frequency));
            }
        }
        flows.Reverse();
        return [.. flows];
    }

    public static CashFlow[] RandomBond(Random rng)
    {
        var maturity = ValuationDate.AddDays(rng.Next(20, 30 * 365));
        int[] frequencies = [0, 1, 2, 4];
        return Bond(maturity, rng.Next(0, 1000) / 10000.0, frequencies[rng.Next(frequencies.Length)]);
    }

    public static double[] BaseParameters(Random rng, bool svensson) => svensson
        ? [U(rng, 0.01, 0.07), U(rng, -0.04, 0.03), U(rng, -0.05, 0.05), U(rng, -0.05, 0.05), U(rng, 0.5, 4), U(rng, 4, 12)]
        : [U(rng, 0.01, 0.07), U(rng, -0.04, 0.03), U(rng, -0.05, 0.05), U(rng, 0.5, 5)];

    public static double[] SpreadParameters(Random rng) =>
        [U(rng, 0.002, 0.03), U(rng, -0.01, 0.01), U(rng, -0.01, 0.01), U(rng, 0.5, 5)];

    /// <summary>A Nelson-Siegel (4 parameters) or Svensson (6 parameters) curve; betas come first in both.</summary>
    public static IFactorCurve Curve(double[] p) =>
        p.Length == NelsonSiegelCurve.ParameterCount ? NelsonSiegelCurve.FromArray(p) : SvenssonCurve.FromArray(p);

    /// <summary>The curve with beta k moved by h (betas are the first FactorCount parameters of both models).</summary>
    public static IFactorCurve Bumped(double[] p, int k, double h)
    {
        var q = (double[])p.Clone();
        q[k] += h;
        return Curve(q);
    }

    /// <summary>Independent present value: sum c exp(-(z_b + s) t) over flows after the valuation date.</summary>
    public static double Value(IReadOnlyList<CashFlow> flows, IFactorCurve baseCurve, IFactorCurve? spread)
    {
        IZeroCurve curve = spread is null ? baseCurve : new SpreadedCurve(baseCurve, spread);
        var value = 0.0;
        foreach (var f in flows)
        {
            var t = CurveTime.YearsBetween(ValuationDate, f.Date);
            if (t > 0)
            {
                value += f.Amount * curve.Discount(t);
            }
        }
        return value;
    }

    public static double U(Random rng, double lo, double hi) => lo + (hi - lo) * rng.NextDouble();
}
