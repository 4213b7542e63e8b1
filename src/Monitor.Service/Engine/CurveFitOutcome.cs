using Monitor.Analytics.Fitting;

namespace Monitor.Service.Engine;

/// <summary>
/// A refit of one curve: accepted (published as the new version) or rejected by the quality gate
/// (the last good curve, if any, stays in use and <see cref="Version"/> is its version).
/// <see cref="Result"/> is null when no fit could be run at all (too few usable quotes): the verdict says why.
/// </summary>
public sealed record CurveFitOutcome(
    string CurveKey,
    bool Accepted,
    CurveFitResult? Result,
    FitQualityVerdict Verdict,
    int Version,
    DateTimeOffset? KeptCurveFittedAt,
    int QuotesOffered);
