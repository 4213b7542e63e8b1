namespace Monitor.Analytics.Attribution;

/// <summary>One named part of a return: in money and as a return (a decimal, 0.01 = 1%).</summary>
/// <param name="Name">What it is, e.g. "base level duration", "spread slope convexity", "base level x slope".</param>
/// <param name="Money">Contribution in money.</param>
/// <param name="Return">Contribution as a return: <paramref name="Money"/> over the horizon value Vh, or a log return where stated.</param>
public readonly record struct ReturnContribution(string Name, double Money, double Return);
