namespace Monitor.Cli.Output;

/// <summary>JSON: one part of a return, in money and in bp of return (log return for the four components, money / Vh for factor terms).</summary>
internal sealed record ContributionView(string Name, double Money, double ReturnBp);
