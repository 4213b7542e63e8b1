namespace Monitor.Analytics.Fitting;

/// <summary>Result of one least-squares solve: iterations, whether it converged, why it stopped, final sum of squares.</summary>
internal readonly record struct SolverOutcome(int Iterations, bool Converged, string ExitReason, double Cost);
