namespace Monitor.Contracts.V1;

/// <summary>
/// Outbound: a curve passed the quality gate and is now in use. Wire identity:
/// <c>Monitor.Contracts.V1.CurveFitted</c>.
/// </summary>
public sealed record CurveFitted
{
    public required string CurveId { get; init; }

    /// <summary>Increases by one with each published fit of this curve.</summary>
    public required long Version { get; init; }

    /// <summary>Time of the quote snapshot the curve was fitted to.</summary>
    public required DateTimeOffset AsOf { get; init; }

    /// <summary>"nelsonSiegel" or "svensson".</summary>
    public required string Model { get; init; }

    /// <summary>For a spread curve, the base curve it is spread over; null for a base curve.</summary>
    public string? BaseCurveId { get; init; }

    public required CurveParameters Parameters { get; init; }

    public required FitSummary Fit { get; init; }

    /// <summary>Id of the message (quote or par yields) that triggered the fit; null for a scheduled refit.</summary>
    public Guid? CauseMessageId { get; init; }

    public required DateTimeOffset FittedAt { get; init; }
}
