namespace Monitor.Cli.Output;

/// <summary>
/// JSON: the factor explanation of one curve move at the horizon: the actual discrete return, the factor moves
/// (new minus old beta, in bp), the duration, convexity and cross-convexity terms, the decay-change (shape) term and
/// the residual.
/// </summary>
internal sealed record CurveExplainView(
    ContributionView Actual,
    IReadOnlyDictionary<string, double> FactorMovesBp,
    IReadOnlyList<ContributionView> Terms,
    ContributionView Shape,
    ContributionView Residual);
