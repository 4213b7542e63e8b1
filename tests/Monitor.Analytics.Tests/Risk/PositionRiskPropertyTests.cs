using FsCheck.Xunit;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Tests.Risk;

/// <summary>
/// Properties of the factor durations and convexities of the domain primer, "Factor durations and convexities":
/// D_k = -(1/P) dP/db_k, C_jk = (1/P) d2P/db_j db_k with the Nelson-Siegel (1987) / Svensson (1994) loadings,
/// factors as in Diebold and Li (2006). Each property checks the analytic figure against finite differences of an
/// independent pricer (sum c exp(-(z_b + s) t) through IZeroCurve.Discount).
/// </summary>
public class PositionRiskPropertyTests
{
    private sealed record Case(CashFlow[] Flows, double[] BaseParameters, double[]? SpreadParameters)
    {
        public int BaseCount => BaseParameters.Length == NelsonSiegelCurve.ParameterCount ? 3 : 4;

        public int FactorCount => BaseCount + (SpreadParameters is null ? 0 : 3);

        public IFactorCurve BaseCurve => RiskTestData.Curve(BaseParameters);

        public IFactorCurve? SpreadCurve => SpreadParameters is null ? null : RiskTestData.Curve(SpreadParameters);

        public FactorExposures Exposures => PositionRisk.Compute(Flows, RiskTestData.ValuationDate, BaseCurve, SpreadCurve);

        // Value with the combined factor vector (base betas, then spread betas) moved by 'bump'.
        public double ValueAt(ReadOnlySpan<double> bump)
        {
            var b = (double[])BaseParameters.Clone();
            for (var k = 0; k < BaseCount; k++)
            {
                b[k] += bump[k];
            }
            double[]? s = null;
            if (SpreadParameters is not null)
            {
                s = (double[])SpreadParameters.Clone();
                for (var k = 0; k < 3; k++)
                {
                    s[k] += bump[BaseCount + k];
                }
            }
            return RiskTestData.Value(Flows, RiskTestData.Curve(b), s is null ? null : RiskTestData.Curve(s));
        }

        public double Duration(FactorExposures e, int f) => f < BaseCount ? e.BaseDuration(f) : e.SpreadDuration(f - BaseCount);

        public double Convexity(FactorExposures e, int j, int k) => (j < BaseCount, k < BaseCount) switch
        {
            (true, true) => e.BaseCrossConvexity(j, k),
            (false, false) => e.SpreadCrossConvexity(j - BaseCount, k - BaseCount),
            (true, false) => e.BaseSpreadCrossConvexity(j, k - BaseCount),
            _ => e.BaseSpreadCrossConvexity(k, j - BaseCount),
        };
    }

    private static Case Draw(int seed)
    {
        var rng = new Random(seed);
        var svensson = rng.Next(2) == 0;
        var credit = rng.Next(2) == 0;
        return new Case(RiskTestData.RandomBond(rng), RiskTestData.BaseParameters(rng, svensson), credit ? RiskTestData.SpreadParameters(rng) : null);
    }

    [Property(MaxTest = 60)]
    public void Factor_durations_equal_central_differences_of_value(int seed)
    {
        // Identity: D_k = -(1/P) dP/db_k (primer; Fisher and Weil 1971 for the level factor).
        // Tolerance: central-difference truncation is (h^2/6) P'''/P <= h^2 t^3 / 6 against D ~ t (loadings <= 1),
        // i.e. relative <= h^2 t_max^2 / 6 = 1.5e-8 at h = 1e-5, t_max = 30; rounding adds eps / h ~ 1e-11 absolute.
        const double h = 1e-5;
        var c = Draw(seed);
        var e = c.Exposures;
        var p = c.ValueAt(new double[c.FactorCount]);
        Assert.Equal(p, e.Value, p * 1e-13);
        for (var f = 0; f < c.FactorCount; f++)
        {
            var up = new double[c.FactorCount];
            var down = new double[c.FactorCount];
            up[f] = h;
            down[f] = -h;
            var fd = -(c.ValueAt(up) - c.ValueAt(down)) / (2 * h * p);
            var analytic = c.Duration(e, f);
            Assert.True(Math.Abs(fd - analytic) <= 1e-7 * Math.Abs(analytic) + 1e-9, $"factor {f}: analytic {analytic:R}, finite difference {fd:R}");
        }
    }

    [Property(MaxTest = 40)]
    public void Factor_convexities_and_cross_convexities_equal_second_differences(int seed)
    {
        // Identity: C_jk = (1/P) d2P/db_j db_k (primer), including mixed base-spread terms.
        // Tolerance: second-difference truncation (h^2/12) P''''/P <= h^2 t^4/12 against C ~ t^2: relative <= 7.5e-7 at
        // h = 1e-4, t_max = 30; rounding ~ 4 eps / h^2 = 4e-8 absolute, so 1e-5 relative plus 1e-6 absolute.
        const double h = 1e-4;
        var c = Draw(seed);
        var e = c.Exposures;
        var n = c.FactorCount;
        var p = c.ValueAt(new double[n]);
        for (var j = 0; j < n; j++)
        {
            for (var k = j; k < n; k++)
            {
                double fd;
                if (j == k)
                {
                    var up = new double[n];
                    var down = new double[n];
                    up[j] = h;
                    down[j] = -h;
                    fd = (c.ValueAt(up) - 2 * p + c.ValueAt(down)) / (h * h * p);
                }
                else
                {
                    fd = (c.ValueAt(Bump(n, j, h, k, h)) - c.ValueAt(Bump(n, j, h, k, -h))
                        - c.ValueAt(Bump(n, j, -h, k, h)) + c.ValueAt(Bump(n, j, -h, k, -h))) / (4 * h * h * p);
                }
                var analytic = c.Convexity(e, j, k);
                Assert.True(Math.Abs(fd - analytic) <= 1e-5 * Math.Abs(analytic) + 1e-6, $"factors ({j},{k}): analytic {analytic:R}, second difference {fd:R}");
            }
        }
    }

    [Property(MaxTest = 60)]
    public void Level_duration_on_a_flat_curve_equals_the_yield_duration(int seed)
    {
        // Identity: on a flat continuously compounded curve the Fisher-Weil (1971) duration equals Macaulay's
        // duration sum(t PV_t)/P, and with continuous compounding modified duration = Macaulay (primer,
        // "Traditional measures": modified = D / (1 + y/f), f -> infinity). Computed here with annual compounding
        // at the equivalent annual yield y_a = e^y - 1 (same discount factors), then modified_annual * (1 + y_a).
        var rng = new Random(seed);
        var flows = RiskTestData.RandomBond(rng);
        var y = RiskTestData.U(rng, 0.0, 0.12);
        var flat = new NelsonSiegelCurve(y, 0.0, 0.0, RiskTestData.U(rng, 0.5, 5));
        var ya = Math.Exp(y) - 1;
        double price = 0, timeWeighted = 0, timeSquaredWeighted = 0;
        foreach (var f in flows)
        {
            var t = CurveTime.YearsBetween(RiskTestData.ValuationDate, f.Date);
            if (t > 0)
            {
                var pv = f.Amount * Math.Pow(1 + ya, -t);
                price += pv;
                timeWeighted += t * pv;
                timeSquaredWeighted += t * t * pv;
            }
        }
        var macaulay = timeWeighted / price;
        var modifiedAnnual = macaulay / (1 + ya);
        var e = PositionRisk.Compute(flows, RiskTestData.ValuationDate, flat);
        Assert.Equal(price, e.Value, price * 1e-12);
        Assert.Equal(modifiedAnnual * (1 + ya), e.BaseDuration(0), 1e-10 * macaulay);
        // Convexity in a continuously compounded yield: (1/P) d2P/dy2 = sum t^2 PV / P.
        Assert.Equal(timeSquaredWeighted / price, e.BaseConvexity(0), 1e-10 * macaulay * macaulay);
        // DV01 = money gained for a 1 bp fall = D P 1e-4 (primer, "Traditional measures").
        Assert.Equal(macaulay * price * 1e-4, e.Dv01, 1e-10 * macaulay * price * 1e-4);
    }

    private static double[] Bump(int n, int j, double hj, int k, double hk)
    {
        var b = new double[n];
        b[j] = hj;
        b[k] = hk;
        return b;
    }
}
