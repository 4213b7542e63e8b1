namespace Monitor.Contracts.V1;

/// <summary>Which fitted curve a figure was computed on: the curve id, its version (increasing per curve) and as-of time.</summary>
public sealed record CurveVersion
{
    public required string CurveId { get; init; }

    public required long Version { get; init; }

    public required DateTimeOffset AsOf { get; init; }
}
