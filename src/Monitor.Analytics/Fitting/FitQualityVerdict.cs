namespace Monitor.Analytics.Fitting;

/// <summary>Outcome of a <see cref="FitQualityGate"/>: passed, or the readable reasons why not.</summary>
public sealed record FitQualityVerdict(bool Passed, IReadOnlyList<string> Reasons);
