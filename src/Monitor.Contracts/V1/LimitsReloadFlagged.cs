namespace Monitor.Contracts.V1;

/// <summary>
/// Outbound alert: a reload of the limits file removed every limit, or removed a limit that stood at warning or breach
/// (ending it by configuration rather than by the exposure). The limits it names also get their own
/// <see cref="LimitStatusChanged"/> to "retired". Wire identity: <c>Monitor.Contracts.V1.LimitsReloadFlagged</c>.
/// </summary>
public sealed record LimitsReloadFlagged
{
    /// <summary>Path of the limits file the service read.</summary>
    public required string Source { get; init; }

    /// <summary>SHA-256 of the file's bytes, lower-case hex (the same value as in the exposure log's record).</summary>
    public required string Sha256 { get; init; }

    /// <summary>Why the reload is flagged, one sentence each.</summary>
    public required IReadOnlyList<string> Reasons { get; init; }

    /// <summary>Ids of every limit the reload removed.</summary>
    public required IReadOnlyList<string> RemovedLimitIds { get; init; }

    /// <summary>Number of limits in force after the reload.</summary>
    public required int LimitCount { get; init; }

    /// <summary>When the service put the new file in force.</summary>
    public required DateTimeOffset ProcessedAt { get; init; }
}
