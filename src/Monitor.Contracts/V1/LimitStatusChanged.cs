namespace Monitor.Contracts.V1;

/// <summary>
/// Outbound: a limit's status changed (one event per change; hysteresis keeps noise from raising
/// storms). Wire identity: <c>Monitor.Contracts.V1.LimitStatusChanged</c>.
/// </summary>
public sealed record LimitStatusChanged
{
    public required string LimitId { get; init; }

    /// <summary>"firm", "desk" or "book".</summary>
    public required string Scope { get; init; }

    public required string ScopeId { get; init; }

    /// <summary>A measure name as in <see cref="BookExposuresUpdated.Measures"/>.</summary>
    public required string Measure { get; init; }

    /// <summary>"within", "warning" or "breach"; "retired" (removed by a limits reload) or "expired" (a temporary limit past its expiry) as a limit's last change.</summary>
    public required string Status { get; init; }

    /// <summary>"within", "warning" or "breach".</summary>
    public required string PreviousStatus { get; init; }

    /// <summary>The scope's exposure, in the measure's units.</summary>
    public required double Exposure { get; init; }

    /// <summary>The bound on the exposure's side (negative for a lower bound), in the measure's units.</summary>
    public required double Limit { get; init; }

    /// <summary>Exposure / Limit on the side approached (0.85 = 85% used).</summary>
    public required double Utilisation { get; init; }

    /// <summary>The curves the exposure was computed on.</summary>
    public required IReadOnlyList<CurveVersion> Curves { get; init; }

    /// <summary>Id of the quote, trade or configuration message that caused the change.</summary>
    public Guid? CauseMessageId { get; init; }

    /// <summary>Wire identity of the causing message, e.g. "Monitor.Contracts.V1.BondQuoted".</summary>
    public required string CauseMessageType { get; init; }

    /// <summary>Time of the causing event (the quote time or trade time).</summary>
    public required DateTimeOffset EventTime { get; init; }

    /// <summary>When the service produced this change.</summary>
    public required DateTimeOffset ProcessedAt { get; init; }

    /// <summary>
    /// True when the status was judged on figures that were built on a stand-in (a spread group without a fitted curve: its bonds valued on the
    /// government curve plus a flat spread from their own price); false (the default, and what a producer that does not
    /// send the member means) when every curve was fitted.
    /// </summary>
    public bool Provisional { get; init; }

    /// <summary>Why the figures are provisional, one reason per bond valued on a stand-in; null when not provisional.</summary>
    public IReadOnlyList<string>? ProvisionalReasons { get; init; }
}
