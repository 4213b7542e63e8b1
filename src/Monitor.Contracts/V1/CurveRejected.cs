namespace Monitor.Contracts.V1;

/// <summary>
/// Outbound: a fit failed the quality gate; the last good curve stays in use. Wire identity:
/// <c>Monitor.Contracts.V1.CurveRejected</c>.
/// </summary>
public sealed record CurveRejected
{
    public required string CurveId { get; init; }

    /// <summary>Time of the quote snapshot the rejected fit used.</summary>
    public required DateTimeOffset AsOf { get; init; }

    /// <summary>Why, one reason per entry (e.g. "rmse 14.2 bp above gate 5 bp").</summary>
    public required IReadOnlyList<string> Reasons { get; init; }

    /// <summary>The rejected fit's report when the fit converged; null otherwise.</summary>
    public FitSummary? Fit { get; init; }

    /// <summary>Version of the curve still in use; null when there is no good curve yet.</summary>
    public long? KeptCurveVersion { get; init; }

    /// <summary>As-of time of the curve still in use; null when there is no good curve yet.</summary>
    public DateTimeOffset? KeptCurveAsOf { get; init; }

    public Guid? CauseMessageId { get; init; }

    public required DateTimeOffset RejectedAt { get; init; }
}
