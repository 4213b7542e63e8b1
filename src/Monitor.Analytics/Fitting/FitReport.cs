namespace Monitor.Analytics.Fitting;

/// <summary>
/// Quality of a fit. Errors are in basis points of yield over the instruments used.
/// <see cref="Iterations"/> counts Levenberg-Marquardt iterations of the full solves (cold-start seeds, warm start, outlier
/// refits), not of the fixed-decay grid. <see cref="WarmStarted"/> is true when the warm start converged without a cold fallback.
/// <see cref="Exclusions"/> holds the caller's pre-exclusions followed by the fitter's own (outliers, matured).
/// </summary>
public sealed record FitReport(
    CurveModel Model,
    FitSolver Solver,
    double RmseBp,
    double MaxAbsErrorBp,
    string? MaxAbsErrorId,
    int Iterations,
    bool Converged,
    string ExitReason,
    bool WarmStarted,
    IReadOnlyList<string> UsedIds,
    IReadOnlyList<FitExclusion> Exclusions,
    IReadOnlyList<FitResidual> Residuals,
    IReadOnlyList<string> Notes);
