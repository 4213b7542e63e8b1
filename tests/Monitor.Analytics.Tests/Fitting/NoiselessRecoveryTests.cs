using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Xunit.Abstractions;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Self-consistency (no external source needed): instruments priced exactly on a known curve must be fitted back.
/// Curve shapes are typical of published fits (upward sloping, a hump; cf. the GSW parameters in Data/), seeded bonds.
/// </summary>
public class NoiselessRecoveryTests(ITestOutputHelper output)
{
    private static readonly NelsonSiegelCurve TrueNs = new(0.045, -0.02, 0.015, 2.0);
    private static readonly SvenssonCurve TrueSvensson = new(0.04, -0.015, -0.02, 0.03, 1.2, 8.0);

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Nelson_Siegel_cold_start_recovers_prices_and_parameters(int seed)
    {
        var bonds = SyntheticBonds.Generate(40, seed, TrueNs);
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions());
        output.WriteLine(FormattableString.Invariant($"seed {seed}: {fit.Curve}, RMSE {fit.Report.RmseBp:E2} bp, {fit.Report.Iterations} it, {fit.Report.ExitReason}"));
        Assert.True(fit.Report.RmseBp < 0.01, FormattableString.Invariant($"RMSE {fit.Report.RmseBp} bp"));
        Assert.True(fit.Report.Converged);
        Assert.Empty(fit.Report.Exclusions);
        var p = fit.Parameters;
        // Betas to 0.01 bp, tau to 1e-4 years: with exact prices and 40 bonds the NS parameters are identified.
        Assert.Equal(TrueNs.Beta0, p[0], 1e-6);
        Assert.Equal(TrueNs.Beta1, p[1], 1e-6);
        Assert.Equal(TrueNs.Beta2, p[2], 1e-6);
        Assert.Equal(TrueNs.Tau, p[3], 1e-4);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void Svensson_cold_start_recovers_yields(int seed)
    {
        var bonds = SyntheticBonds.Generate(60, seed, TrueSvensson);
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions { Model = CurveModel.Svensson });
        output.WriteLine(FormattableString.Invariant($"seed {seed}: {fit.Curve}, RMSE {fit.Report.RmseBp:E2} bp, {fit.Report.Iterations} it"));
        Assert.True(fit.Report.RmseBp < 0.01, FormattableString.Invariant($"RMSE {fit.Report.RmseBp} bp"));
        // Svensson parameters need not be identified (two humps can trade places); the zero curve must be.
        for (var t = 0.5; t <= 30; t += 0.5)
        {
            Assert.InRange((fit.Curve.ZeroRate(t) - TrueSvensson.ZeroRate(t)) * 1e4, -0.05, 0.05);
        }
    }

    [Theory]
    [InlineData(CurveModel.NelsonSiegel)]
    [InlineData(CurveModel.Svensson)]
    public void Warm_start_from_perturbed_parameters_converges_in_few_iterations(CurveModel model)
    {
        IFactorCurve truth = model == CurveModel.NelsonSiegel ? TrueNs : TrueSvensson;
        var truthParams = model == CurveModel.NelsonSiegel ? TrueNs.ToArray() : TrueSvensson.ToArray();
        var bonds = SyntheticBonds.Generate(60, 7, truth);
        // An intraday move: betas by 5-20 bp, decays by 5%.
        var warm = truthParams.Select((v, k) => FactorShapeIsDecay(model, k) ? v * 1.05 : v + (k % 2 == 0 ? 0.0015 : -0.0008)).ToArray();
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions { Model = model }, warm);
        output.WriteLine(FormattableString.Invariant($"{model}: {fit.Report.Iterations} iterations, RMSE {fit.Report.RmseBp:E2} bp, {fit.Report.ExitReason}"));
        Assert.True(fit.Report.WarmStarted);
        Assert.True(fit.Report.Converged);
        Assert.True(fit.Report.RmseBp < 0.01);
        // "Few": the warm start must not fall back to the cold start, and stays well below the warm cap (common practice, no source).
        Assert.InRange(fit.Report.Iterations, 1, 15);
    }

    [Fact]
    public void Spread_fit_over_a_known_base_recovers_the_spread_curve()
    {
        var spread = new NelsonSiegelCurve(0.012, -0.004, 0.006, 1.5);
        var credit = new SpreadedCurve(TrueNs, spread);
        var bonds = SyntheticBonds.Generate(30, 11, credit);
        var fit = new SpreadCurveFitter().Fit(TrueNs, bonds, new CurveFitOptions());
        output.WriteLine(FormattableString.Invariant($"{fit.Curve}, RMSE {fit.Report.RmseBp:E2} bp, {fit.Report.Iterations} it"));
        Assert.True(fit.Report.RmseBp < 0.01);
        Assert.Equal(spread.Beta0, fit.Parameters[0], 1e-6);
        Assert.Equal(spread.Beta1, fit.Parameters[1], 1e-6);
        Assert.Equal(spread.Beta2, fit.Parameters[2], 1e-6);
        Assert.Equal(spread.Tau, fit.Parameters[3], 1e-3);

        var warm = new SpreadCurveFitter().Fit(TrueNs, bonds, new CurveFitOptions(), [0.013, -0.0035, 0.005, 1.6]);
        Assert.True(warm.Report.WarmStarted);
        Assert.True(warm.Report.RmseBp < 0.01);
    }

    [Fact]
    public void Par_yield_fit_recovers_a_curve_from_its_own_par_yields()
    {
        // Par yields by ParYield.Compute (frequency 2) at the Treasury tenors, then fitted back.
        double[] tenors = [1 / 12.0, 2 / 12.0, 0.25, 4 / 12.0, 0.5, 1, 2, 3, 5, 7, 10, 20, 30];
        var points = tenors.Select(t => new ParYieldPoint(t, ParYield.Compute(TrueNs, t, 2))).ToList();
        var fit = new ParYieldCurveFitter().Fit(points, new CurveFitOptions());
        Assert.True(fit.Report.RmseBp < 0.01, FormattableString.Invariant($"RMSE {fit.Report.RmseBp} bp"));
        Assert.Equal(TrueNs.Tau, fit.Parameters[3], 1e-3);
    }

    private static bool FactorShapeIsDecay(CurveModel model, int k) => model == CurveModel.NelsonSiegel ? k == 3 : k >= 4;
}
