using Monitor.Analytics.Fitting;

namespace Monitor.Cli.Verbs;

/// <summary>
/// One fitted curve of a snapshot: its key (<see cref="Analytics.Risk.CurveKey.Government"/> or a spread group), the
/// fit result, the gate it was judged by and the verdict, and the priced quotes offered to it (for the residual table).
/// </summary>
internal sealed record FittedCurve(
    string Key,
    CurveFitResult Result,
    FitQualityGate Gate,
    FitQualityVerdict Verdict,
    IReadOnlyList<PricedBondQuote> Quotes)
{
    public bool IsGovernment => Key.Length == 0;

    /// <summary>"government" or the spread group's name.</summary>
    public string Label => IsGovernment ? "government" : Key;
}
