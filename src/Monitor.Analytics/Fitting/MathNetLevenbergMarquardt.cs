using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// The same problem through MathNet.Numerics 5 <see cref="LevenbergMarquardtMinimizer"/> with
/// <see cref="ObjectiveFunction.NonlinearModel(Func{Vector{double}, Vector{double}, Vector{double}}, Func{Vector{double}, Vector{double}, Matrix{double}}, Vector{double}, Vector{double}, Vector{double})"/>:
/// model f(p; x_i) = -r_i(p) against observations y_i = 0, so that y - f = r; its Jacobian is -dr/dp.
/// MathNet handles bounds by a change of variables, so the start is moved strictly inside the box; fixed parameters
/// (a box of one point) go through its isFixed list.
/// Allocates vectors per evaluation: kept as a cross-check and a fallback, not for the hot path.
/// </summary>
internal static class MathNetLevenbergMarquardt
{
    public static SolverOutcome Solve(
        ILeastSquaresProblem problem,
        Span<double> p,
        ReadOnlySpan<double> lower,
        ReadOnlySpan<double> upper,
        ReadOnlySpan<bool> isFixed,
        int maxIterations)
    {
        var n = problem.ParameterCount;
        var m = problem.ActiveCount;
        var r = new double[m];
        var jac = new double[m * n];
        Vector<double> Model(Vector<double> parameters, Vector<double> x)
        {
            problem.Evaluate(parameters.AsArray() ?? parameters.ToArray(), r, []);
            var y = Vector<double>.Build.Dense(m);
            for (var i = 0; i < m; i++)
            {
                y[i] = -r[i];
            }
            return y;
        }
        Matrix<double> Derivatives(Vector<double> parameters, Vector<double> x)
        {
            problem.Evaluate(parameters.AsArray() ?? parameters.ToArray(), r, jac);
            var d = Matrix<double>.Build.Dense(m, n);
            for (var i = 0; i < m; i++)
            {
                for (var k = 0; k < n; k++)
                {
                    d[i, k] = -jac[i * n + k];
                }
            }
            return d;
        }

        var xs = Vector<double>.Build.Dense(m, i => i);
        var ys = Vector<double>.Build.Dense(m);
        var objective = ObjectiveFunction.NonlinearModel(Model, Derivatives, xs, ys);
        var lo = Vector<double>.Build.Dense(n);
        var hi = Vector<double>.Build.Dense(n);
        var guess = Vector<double>.Build.Dense(n);
        var fixedFlags = new List<bool>(n);
        for (var k = 0; k < n; k++)
        {
            fixedFlags.Add(isFixed[k]);
            if (isFixed[k])
            {
                // MathNet keeps a fixed parameter at its guess; its bounds must still be a proper interval for the change of variables.
                lo[k] = lower[k] - 1.0;
                hi[k] = upper[k] + 1.0;
                guess[k] = lower[k];
                continue;
            }
            lo[k] = lower[k];
            hi[k] = upper[k];
            var margin = 1e-9 * (upper[k] - lower[k]);
            guess[k] = Math.Clamp(p[k], lower[k] + margin, upper[k] - margin);
        }
        var minimizer = new LevenbergMarquardtMinimizer(
            initialMu: 1e-3, gradientTolerance: 1e-18, stepTolerance: 1e-15, functionTolerance: 1e-24, maximumIterations: maxIterations);
        try
        {
            var result = minimizer.FindMinimum(objective, guess, lo, hi, null, fixedFlags);
            for (var k = 0; k < n; k++)
            {
                p[k] = result.MinimizingPoint[k];
            }
            problem.Evaluate(p, r, []);
            var cost = r.Sum(v => v * v);
            var converged = result.ReasonForExit is not (ExitCondition.ExceedIterations or ExitCondition.InvalidValues or ExitCondition.None or ExitCondition.ManuallyStopped);
            return new SolverOutcome(result.Iterations, converged, "MathNet: " + result.ReasonForExit, cost);
        }
        catch (MaximumIterationsException ex)
        {
            return new SolverOutcome(maxIterations, false, "MathNet: " + ex.Message, double.NaN);
        }
    }
}
