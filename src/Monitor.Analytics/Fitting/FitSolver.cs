namespace Monitor.Analytics.Fitting;

/// <summary>Which Levenberg-Marquardt implementation runs the full fit (both use the analytic Jacobian).</summary>
public enum FitSolver
{
    /// <summary>Our own LM over preallocated arrays (Cholesky on the small normal equations, bounds by projection).</summary>
    Native,

    /// <summary>MathNet.Numerics 5 <c>LevenbergMarquardtMinimizer</c> (allocates per evaluation; slower).</summary>
    MathNet,
}
