namespace Monitor.Cli.Output;

/// <summary>
/// JSON: the factor explanation of one curve move at the horizon: the actual discrete return, the factor moves
/// (new minus old beta, in bp), the duration, convexity and cross-convexity terms, the decay-change (shape) term and
/// the residual. <c>factorMovesOf</c> names the spread group whose moves are shown (the first held, in name order;
/// the terms add every group's contribution); null for the base curve.
/// </summary>
internal sealed record CurveExplainView(
    ContributionView Actual,
    string? FactorMovesOf,
    IReadOnlyDictionary<string, double> FactorMovesBp,
    IReadOnlyList<ContributionView> Terms,
    ContributionView Shape,
    ContributionView Residual);
