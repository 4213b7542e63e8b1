using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Xunit.Abstractions;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Spread fits over the demo day's sparse groups (<see cref="DemoSpreadQuotes"/>), warm-started from the previous burst's
/// parameters as the service refits them. Before the decay was tied to the group's durations (commit 97bec63), each case
/// below stopped at the iteration limit (25 warm, then 200+ cold iterations) in a degenerate valley: b1 = -1, b2 = +0.99,
/// tau = 0.2 to 0.3 years, a spread slope of -100% cancelled by the curvature; the gate refused the refit. Checks are
/// common practice, no source: a converged warm refit must land where a cold fit does, and the demo's truth is known.
/// </summary>
public class SparseSpreadFitTests(ITestOutputHelper output)
{
    // The service's default spread gate (MonitorOptions: RMSE 15 bp, largest residual 60 bp, at least 4 bonds).
    private static readonly FitQualityGate SpreadGate = new(15, 60, 4);

    // Warm and cold fits agree to this (bp of spread), far below the 1.5 bp quote noise.
    private const double SameSolutionBp = 0.01;

    private static readonly double[] Maturities = [0.5, 1, 2, 3, 5, 7, 10, 12];

    [Theory]
    [InlineData("UTIL-A", 2010, 10)]
    [InlineData("INDUSTRIAL-BBB", 1023, 23)]
    public void Five_bond_warm_refit_converges_to_the_cold_solution(string group, int seed, int step)
    {
        var bonds = group == "UTIL-A" ? DemoSpreadQuotes.UtilA : DemoSpreadQuotes.IndustrialBbb;
        var (warm, cold, truth) = FitBoth(bonds, group, seed, step);

        Assert.True(warm.Report.Converged, warm.Report.ExitReason);
        Assert.True(warm.Report.WarmStarted, string.Join("; ", warm.Report.Notes)); // no fallback to a cold start
        Assert.True(SpreadGate.Evaluate(warm.Report).Passed, string.Join("; ", SpreadGate.Evaluate(warm.Report).Reasons));
        Assert.True(cold.Report.Converged, cold.Report.ExitReason);
        AssertSameCurve(cold.Curve, warm.Curve, SameSolutionBp);
        // Not a degenerate corner: the betas stay of the order of the spreads (they were +-1 = +-100% before).
        Assert.InRange(Math.Abs(warm.Parameters[1]), 0, 0.05);
        Assert.InRange(Math.Abs(warm.Parameters[2]), 0, 0.05);
        // Inside the bonds' span (2.5 to 10 years) the fit stays within a few noise widths (1.5 bp) of the demo's true spread.
        foreach (var t in new[] { 3.0, 5.0, 8.0 })
        {
            Assert.InRange((warm.Curve.ZeroRate(t) - truth.ZeroRate(t)) * 1e4, -6, 6);
        }
    }

    [Fact]
    public void Ten_bonds_over_the_same_narrow_span_still_converge_with_an_estimated_decay()
    {
        // Both groups' bonds priced on the UTIL-A curve: enough bonds to estimate the decay, the same 2.5..10 year span.
        var bonds = DemoSpreadQuotes.UtilA.Concat(DemoSpreadQuotes.IndustrialBbb).ToArray();
        var (warm, cold, _) = FitBoth(bonds, "UTIL-A", 5046, 46);

        Assert.True(warm.Report.Converged, warm.Report.ExitReason);
        Assert.True(cold.Report.Converged, cold.Report.ExitReason);
        AssertSameCurve(cold.Curve, warm.Curve, SameSolutionBp);
        // The decay is estimated, and kept where the curvature hump (x = 1.7933) lies inside the bonds' duration span.
        var durations = FisherWeilDurations(DemoSpreadQuotes.Burst(bonds, 46 / 54.0, new Random(5046), "UTIL-A"), "UTIL-A", 46 / 54.0);
        Assert.InRange(warm.Parameters[3], durations.Min() / 1.7933 * 0.99, durations.Max() / 1.7933 * 1.01);
    }

    [Fact]
    public void Five_bonds_hold_the_decay_at_mid_span_and_more_bonds_free_it()
    {
        var bonds = DemoSpreadQuotes.UtilA;
        var f = 0.5;
        var baseCurve = DemoSpreadQuotes.Government(f);
        var first = DemoSpreadQuotes.Burst(bonds, f, new Random(11));
        var second = DemoSpreadQuotes.Burst(bonds, f, new Random(12));
        var fitter = new SpreadCurveFitter();
        var a = fitter.Fit(baseCurve, first, new CurveFitOptions());
        var b = fitter.Fit(baseCurve, second, new CurveFitOptions(), a.Parameters);

        // Held: the same decay whatever the noise, where the curvature loading peaks mid-span of the bonds' Fisher-Weil
        // durations (here on the true curve; the engine's on the base curve plus each bond's flat z-spread: 1% apart at most).
        var durations = FisherWeilDurations(first, "UTIL-A", f);
        var midSpan = 0.5 * (durations.Min() + durations.Max()) / 1.7933;
        Assert.InRange(a.Parameters[3], midSpan * 0.99, midSpan * 1.01);
        Assert.Equal(a.Parameters[3], b.Parameters[3], 1e-3);

        // Asking for no surplus frees the decay for these five bonds: it then moves with the noise.
        var free = new CurveFitOptions { FreeSpreadDecayMinSurplus = 0 };
        var c = new SpreadCurveFitter().Fit(baseCurve, first, free);
        var d = new SpreadCurveFitter().Fit(baseCurve, second, free);
        Assert.True(c.Report.Converged && d.Report.Converged, c.Report.ExitReason + " / " + d.Report.ExitReason);
        Assert.True(Math.Abs(c.Parameters[3] - d.Parameters[3]) > 1e-3, FormattableString.Invariant($"free decays {c.Parameters[3]} and {d.Parameters[3]}"));
    }

    [Fact]
    public void A_negative_free_decay_surplus_is_refused_by_name()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() =>
            new SpreadCurveFitter().Fit(DemoSpreadQuotes.Government(0), DemoSpreadQuotes.Burst(DemoSpreadQuotes.UtilA, 0, new Random(1)), new CurveFitOptions { FreeSpreadDecayMinSurplus = -1 }));
        Assert.Contains("FreeSpreadDecayMinSurplus", ex.Message, StringComparison.Ordinal);
        Assert.Contains("-1", ex.Message, StringComparison.Ordinal);
    }

    /// <summary>Burst <paramref name="step"/> fitted warm from the previous burst's true spread and fitted cold.</summary>
    private (CurveFitResult Warm, CurveFitResult Cold, NelsonSiegelCurve Truth) FitBoth(Bond[] bonds, string group, int seed, int step)
    {
        var f = step / (double)DemoSpreadQuotes.LastStep;
        var previous = DemoSpreadQuotes.Spread(group, (step - 1) / (double)DemoSpreadQuotes.LastStep);
        var quotes = DemoSpreadQuotes.Burst(bonds, f, new Random(seed), group);
        var baseCurve = DemoSpreadQuotes.Government(f);
        var warm = new SpreadCurveFitter().Fit(baseCurve, quotes, new CurveFitOptions(), previous.ToArray());
        var cold = new SpreadCurveFitter().Fit(baseCurve, quotes, new CurveFitOptions());
        output.WriteLine(FormattableString.Invariant($"warm {warm.Curve} {warm.Report.Iterations} it ({warm.Report.ExitReason}), RMSE {warm.Report.RmseBp:F3} bp"));
        output.WriteLine(FormattableString.Invariant($"cold {cold.Curve} {cold.Report.Iterations} it ({cold.Report.ExitReason}), RMSE {cold.Report.RmseBp:F3} bp"));
        return (warm, cold, DemoSpreadQuotes.Spread(group, f));
    }

    /// <summary>Fisher-Weil duration sum(t c DF) / sum(c DF) on the demo's true curve (Fisher and Weil 1971, J. Business 44).</summary>
    private static double[] FisherWeilDurations(IEnumerable<FitInstrument> quotes, string group, double f)
    {
        var curve = new SpreadedCurve(DemoSpreadQuotes.Government(f), DemoSpreadQuotes.Spread(group, f));
        return quotes.Select(q =>
        {
            double pv = 0, tpv = 0;
            for (var j = 0; j < q.Times.Length; j++)
            {
                var v = q.Amounts[j] * curve.Discount(q.Times[j]);
                pv += v;
                tpv += q.Times[j] * v;
            }
            return tpv / pv;
        }).ToArray();
    }

    private static void AssertSameCurve(IZeroCurve expected, IZeroCurve actual, double toleranceBp)
    {
        foreach (var t in Maturities)
        {
            Assert.InRange((actual.ZeroRate(t) - expected.ZeroRate(t)) * 1e4, -toleranceBp, toleranceBp);
        }
    }
}
