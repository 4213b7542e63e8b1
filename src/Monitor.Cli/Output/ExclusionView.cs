namespace Monitor.Cli.Output;

/// <summary>JSON: a quote left out of a fit; <c>reason</c> is Stale, Outlier, Matured, Unknown or Invalid.</summary>
internal sealed record ExclusionView(string Id, string Reason, string Detail);
