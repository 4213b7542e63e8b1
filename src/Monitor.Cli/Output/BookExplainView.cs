namespace Monitor.Cli.Output;

/// <summary>
/// JSON: a book's holding-period return. Values in money: v0 (t0 curves at t0), vh (t0 curves at t1, carry and
/// roll-down), vb (new base curve), vs (new spreads), v1 (t1 curves), each at t1 including received cash.
/// <c>components</c> (horizon, base curve, spread, interaction) add up to <c>totalPnl</c> in money and to
/// <c>totalReturnBp</c> = 1e4 ln(v1/v0) in bp.
/// </summary>
internal sealed record BookExplainView(
    string Book,
    double V0,
    double Vh,
    double Vb,
    double Vs,
    double V1,
    double ReceivedCash,
    double TotalPnl,
    double TotalReturnBp,
    IReadOnlyList<ContributionView> Components,
    CurveExplainView Base,
    CurveExplainView? Spread);
