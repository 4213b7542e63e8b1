using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>Outlier rejection and the quality gate (common practice, no source; see the domain primer's guard rails).</summary>
public class OutlierAndGateTests
{
    private static readonly NelsonSiegelCurve Truth = new(0.045, -0.02, 0.015, 2.0);

    private static List<FitInstrument> NoisyBonds(int seed, double noiseBp)
    {
        var rng = new Random(seed);
        return [.. SyntheticBonds.Generate(40, seed, Truth).Select(b => SyntheticBonds.ShiftYield(b, (rng.NextDouble() - 0.5) * 2 * noiseBp))];
    }

    [Fact]
    public void A_corrupted_quote_is_excluded_as_an_outlier_with_its_residual()
    {
        var bonds = NoisyBonds(3, 1.0);
        var clean = bonds[17];
        bonds[17] = SyntheticBonds.ShiftYield(bonds[17], -80); // a fat-finger price, 80 bp rich to first order
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions());
        var exclusion = Assert.Single(fit.Report.Exclusions);
        Assert.Equal(bonds[17].Id, exclusion.Id);
        Assert.Equal(FitExclusionReason.Outlier, exclusion.Reason);
        Assert.Contains("bp", exclusion.Detail, StringComparison.Ordinal);
        Assert.DoesNotContain(bonds[17].Id, fit.Report.UsedIds);
        Assert.Equal(39, fit.Report.UsedIds.Count);
        // The residual of the dropped bond is still reported (market minus model, negative: the bond is rich). The report's
        // measure is (P_model - P_quote) / (P_quote D); with P_model ~ the clean price that is known in closed form; 3 bp
        // allow for the 1 bp noise and the fit.
        var expectedBp = (clean.DirtyPrice - bonds[17].DirtyPrice) / (bonds[17].DirtyPrice * bonds[17].Duration) * 1e4;
        var r = fit.Report.Residuals.Single(x => x.Id == bonds[17].Id);
        Assert.False(r.Used);
        Assert.InRange(r.ResidualBp, expectedBp - 3, expectedBp + 3);
        Assert.True(expectedBp < -50);
        // Uniform noise of +/-1 bp has an RMSE of 1/sqrt(3) = 0.58 bp; the refit is back at that level.
        Assert.True(fit.Report.RmseBp < 0.8, FormattableString.Invariant($"RMSE {fit.Report.RmseBp}"));
    }

    [Fact]
    public void Outliers_are_never_dropped_below_the_parameter_count_plus_margin()
    {
        var bonds = NoisyBonds(4, 1.0).Take(8).ToList();
        for (var i = 0; i < 4; i++)
        {
            bonds[i] = SyntheticBonds.ShiftYield(bonds[i], 100 * (i + 1));
        }
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions { OutlierMinSurplus = 3 });
        // 4 parameters + 3 = 7 instruments must stay.
        Assert.True(fit.Report.UsedIds.Count >= 7);
    }

    [Fact]
    public void Pre_excluded_instruments_are_skipped_and_reported()
    {
        var bonds = NoisyBonds(5, 0.5);
        var stale = new FitExclusion(bonds[0].Id, FitExclusionReason.Stale, "last quote 2 hours old");
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions(), preExcluded: [stale]);
        Assert.Contains(stale, fit.Report.Exclusions);
        Assert.DoesNotContain(bonds[0].Id, fit.Report.UsedIds);
        Assert.Equal(39, fit.Report.UsedIds.Count);
    }

    [Fact]
    public void A_matured_instrument_is_excluded_as_matured()
    {
        var bonds = NoisyBonds(6, 0.5);
        bonds.Add(new FitInstrument("OLD", [-0.1], [101.0], 100.0, 0.1));
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions());
        Assert.Contains(fit.Report.Exclusions, e => e.Id == "OLD" && e.Reason == FitExclusionReason.Matured);
    }

    [Fact]
    public void A_fit_failing_the_gate_gives_readable_reasons()
    {
        var fit = new BondCurveFitter().Fit(NoisyBonds(8, 12.0), new CurveFitOptions { RejectOutliers = false });
        var verdict = new FitQualityGate(MaxRmseBp: 2.0, MaxAbsErrorBp: 5.0, MinInstruments: 50).Evaluate(fit.Report);
        Assert.False(verdict.Passed);
        Assert.Equal(3, verdict.Reasons.Count);
        Assert.Contains(verdict.Reasons, r => r.StartsWith("RMSE", StringComparison.Ordinal) && r.Contains("2.00 bp", StringComparison.Ordinal));
        Assert.Contains(verdict.Reasons, r => r.StartsWith("largest residual", StringComparison.Ordinal) && r.Contains(fit.Report.MaxAbsErrorId!, StringComparison.Ordinal));
        Assert.Contains(verdict.Reasons, r => r.Contains("only 40 instruments used, at least 50 required", StringComparison.Ordinal));
    }

    [Fact]
    public void A_good_fit_passes_the_gate()
    {
        var fit = new BondCurveFitter().Fit(NoisyBonds(9, 1.0), new CurveFitOptions());
        var verdict = new FitQualityGate(MaxRmseBp: 2.0, MaxAbsErrorBp: 5.0, MinInstruments: 20).Evaluate(fit.Report);
        Assert.True(verdict.Passed, string.Join("; ", verdict.Reasons));
        Assert.Empty(verdict.Reasons);
    }

    [Fact]
    public void Non_convergence_fails_a_gate_that_requires_it()
    {
        var fit = new BondCurveFitter().Fit(NoisyBonds(10, 3.0), new CurveFitOptions { MaxIterations = 1, TauGridPoints = 2, RejectOutliers = false });
        var verdict = new FitQualityGate(1000, 1000, 1, RequireConvergence: true).Evaluate(fit.Report);
        Assert.False(fit.Report.Converged);
        Assert.Contains(verdict.Reasons, r => r.StartsWith("the fit did not converge", StringComparison.Ordinal));
    }
}
