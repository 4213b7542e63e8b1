namespace Monitor.Analytics.Risk;

/// <summary>A book's exposures in total and per curve key (government and each spread group).</summary>
/// <param name="Total">All curve keys together; spread figures summed factor by factor over spread groups.</param>
/// <param name="ByCurveKey">Exposures of the flows under each curve key the book holds.</param>
public sealed record BookRisk(FactorExposures Total, IReadOnlyDictionary<string, FactorExposures> ByCurveKey);
