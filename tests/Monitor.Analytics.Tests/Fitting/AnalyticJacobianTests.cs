using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// The analytic Jacobians (dP/db_k = -sum c t L_k DF; decays via S'(x), C'(x) and dx/dtau = -t/tau^2) against central
/// finite differences (a standard numerical check: error O(h^2)).
/// </summary>
public class AnalyticJacobianTests
{
    public static TheoryData<CurveModel, bool> Cases() => new()
    {
        { CurveModel.NelsonSiegel, false },
        { CurveModel.Svensson, false },
        { CurveModel.NelsonSiegel, true },
        { CurveModel.Svensson, true },
    };

    private static double[] Params(CurveModel model) =>
        model == CurveModel.NelsonSiegel ? [0.04, -0.018, 0.012, 1.7] : [0.042, -0.016, -0.02, 0.025, 1.1, 7.5];

    [Theory]
    [MemberData(nameof(Cases))]
    public void Bond_price_residual_Jacobian_matches_finite_differences(CurveModel model, bool spreadOverBase)
    {
        var pricing = new NelsonSiegelCurve(0.05, -0.01, 0.02, 2.5);
        // Random maturities plus bonds on a common schedule (shared coupon times, evaluated once per distinct time).
        var bonds = SyntheticBonds.Generate(12, 21, pricing)
            .Concat([SyntheticBonds.Price("S5", 5.0, 3.0, pricing), SyntheticBonds.Price("S10", 10.0, 4.5, pricing), SyntheticBonds.Price("S7", 7.0, 0.0, pricing)])
            .Select(b => new ValidInstrument(b.Id, b.Times, b.Amounts, b.DirtyPrice, b.Duration)).ToList();
        Func<double, double>? baseDf = spreadOverBase ? new NelsonSiegelCurve(0.03, -0.01, 0.005, 1.0).Discount : null;
        Check(new CashFlowProblem(model, bonds, baseDf), Params(model));
    }

    [Theory]
    [InlineData(CurveModel.NelsonSiegel)]
    [InlineData(CurveModel.Svensson)]
    public void Par_yield_residual_Jacobian_matches_finite_differences(CurveModel model)
    {
        double[] tenors = [1 / 12.0, 0.25, 0.5, 0.75, 1, 2, 3.25, 5, 10, 30];
        var points = tenors.Select(t => (ParYieldCurveFitter.TenorLabel(t), t, 0.03 + 0.001 * t)).ToList();
        Check(new ParYieldProblem(model, points, 2), Params(model));
    }

    private static void Check(ILeastSquaresProblem problem, double[] p)
    {
        var m = problem.ActiveCount;
        var n = problem.ParameterCount;
        var r = new double[m];
        var jac = new double[m * n];
        problem.Evaluate(p, r, jac);
        var up = new double[m];
        var down = new double[m];
        for (var k = 0; k < n; k++)
        {
            var h = 1e-6 * Math.Max(1.0, Math.Abs(p[k]));
            var pu = (double[])p.Clone();
            var pd = (double[])p.Clone();
            pu[k] += h;
            pd[k] -= h;
            problem.Evaluate(pu, up, []);
            problem.Evaluate(pd, down, []);
            for (var i = 0; i < m; i++)
            {
                var fd = (up[i] - down[i]) / (2 * h);
                var analytic = jac[i * n + k];
                Assert.True(Math.Abs(fd - analytic) <= 1e-6 * Math.Max(1e-3, Math.Abs(analytic)),
                    FormattableString.Invariant($"point {i}, parameter {k}: analytic {analytic}, finite difference {fd}"));
            }
        }
        // The single-point and all-points residuals agree with the batch evaluation.
        var all = new double[problem.PointCount];
        problem.AllResiduals(p, all);
        for (var i = 0; i < m; i++)
        {
            Assert.Equal(r[i], problem.Residual(p, i), 14);
            Assert.Equal(r[i], all[i], 14);
        }
    }
}
