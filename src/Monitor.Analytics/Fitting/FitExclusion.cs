namespace Monitor.Analytics.Fitting;

/// <summary>An instrument left out of a fit, the reason, and a readable detail (for an outlier: its residual in bp).</summary>
public sealed record FitExclusion(string Id, FitExclusionReason Reason, string Detail);
