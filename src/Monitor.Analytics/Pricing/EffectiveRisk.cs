namespace Monitor.Analytics.Pricing;

/// <summary>
/// Curve-based risk from parallel shifts of +/- <paramref name="Shift"/> (continuously compounded zero rates):
/// duration (P- - P+) / (2 P delta), convexity (P- + P+ - 2 P) / (P delta^2). Price per 100 face; years; years^2.
/// </summary>
public sealed record EffectiveRisk(double DirtyPrice, double Duration, double Convexity, double Shift);
