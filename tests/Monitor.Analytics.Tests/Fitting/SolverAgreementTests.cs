using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Xunit.Abstractions;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Our Levenberg-Marquardt against MathNet.Numerics 5.0.0 LevenbergMarquardtMinimizer (reference library) on the same
/// noisy problem: both must reach the same least-squares minimum.
/// </summary>
public class SolverAgreementTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(CurveModel.NelsonSiegel)]
    [InlineData(CurveModel.Svensson)]
    public void Native_and_MathNet_solvers_give_the_same_fit(CurveModel model)
    {
        IZeroCurve truth = model == CurveModel.NelsonSiegel
            ? new NelsonSiegelCurve(0.045, -0.02, 0.015, 2.0)
            : new SvenssonCurve(0.04, -0.015, -0.02, 0.03, 1.2, 8.0);
        var rng = new Random(5);
        // 2 bp of seeded yield noise, so the minimum is not an exact fit.
        var bonds = SyntheticBonds.Generate(50, 5, truth).Select(b => SyntheticBonds.ShiftYield(b, 2 * (rng.NextDouble() - 0.5) * 2)).ToList();
        var native = new BondCurveFitter().Fit(bonds, new CurveFitOptions { Model = model, RejectOutliers = false });
        // MathNet starts from the native answer perturbed, so both solvers must find the minimum on their own.
        var start = native.Parameters.Select((v, k) => v * 1.02).ToArray();
        var mathNet = new BondCurveFitter().Fit(bonds, new CurveFitOptions { Model = model, RejectOutliers = false, Solver = FitSolver.MathNet, WarmMaxIterations = 500 }, start);
        output.WriteLine(FormattableString.Invariant($"native {native.Curve} RMSE {native.Report.RmseBp:F6} bp, {native.Report.Iterations} it"));
        output.WriteLine(FormattableString.Invariant($"MathNet {mathNet.Curve} RMSE {mathNet.Report.RmseBp:F6} bp, {mathNet.Report.Iterations} it, {mathNet.Report.ExitReason}"));
        Assert.Equal(native.Report.RmseBp, mathNet.Report.RmseBp, 1e-4);
        for (var t = 0.5; t <= 30; t += 0.5)
        {
            // Same curve to 0.01 bp of zero yield.
            Assert.InRange((native.Curve.ZeroRate(t) - mathNet.Curve.ZeroRate(t)) * 1e4, -0.01, 0.01);
        }
    }
}
