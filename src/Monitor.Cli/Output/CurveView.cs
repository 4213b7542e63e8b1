namespace Monitor.Cli.Output;

/// <summary>
/// JSON: one fitted curve. <c>curve</c> is "government", a spread group or "par-yields"; <c>kind</c> "base" or
/// "spread"; <c>parameters</c> decimals (b0.. or g0..) and decays in years; fit errors in bp of yield.
/// </summary>
internal sealed record CurveView(
    string Curve,
    string Kind,
    string Model,
    IReadOnlyDictionary<string, double> Parameters,
    double RmseBp,
    double MaxAbsErrorBp,
    string? MaxAbsErrorId,
    int Iterations,
    bool Converged,
    string ExitReason,
    int UsedCount,
    IReadOnlyList<string> Notes,
    GateView Gate,
    IReadOnlyList<ResidualView> Residuals,
    IReadOnlyList<ExclusionView> Excluded,
    IReadOnlyList<CurvePointView> Points);
