namespace Monitor.Contracts.V1;

/// <summary>
/// Inbound: par yields at standard tenors for one curve (the form in which official constant-maturity
/// yields are published). Wire identity: <c>Monitor.Contracts.V1.ParYieldsPublished</c>.
/// </summary>
public sealed record ParYieldsPublished
{
    public required string CurveId { get; init; }

    public required DateTimeOffset AsOf { get; init; }

    public required IReadOnlyList<ParYieldPoint> Points { get; init; }

    public required string Source { get; init; }
}
