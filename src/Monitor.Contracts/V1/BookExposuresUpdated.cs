namespace Monitor.Contracts.V1;

/// <summary>
/// A book's exposures after a trade or a curve change. Published inside a <see cref="BookExposuresBatch"/>, never
/// alone.
/// </summary>
public sealed record BookExposuresUpdated
{
    public required string Book { get; init; }

    /// <summary>
    /// Measure name -&gt; value. Names: "marketValue" (money), "dv01", "baseLevel", "baseSlope",
    /// "baseCurvature", "spreadLevel", "spreadSlope", "spreadCurvature" (money per bp; value lost for a
    /// 1 bp rise, positive when long), "convexity" (money per bp squared).
    /// </summary>
    public required IReadOnlyDictionary<string, double> Measures { get; init; }

    /// <summary>The curves the figures were computed on.</summary>
    public required IReadOnlyList<CurveVersion> Curves { get; init; }

    public Guid? CauseMessageId { get; init; }

    /// <summary>Wire identity of the causing message, e.g. "Monitor.Contracts.V1.TradeBooked".</summary>
    public string? CauseMessageType { get; init; }

    public required DateTimeOffset ComputedAt { get; init; }

    /// <summary>
    /// True when the figures were built on a stand-in (a spread group without a fitted curve: its bonds valued on the
    /// government curve plus a flat spread from their own price); false (the default, and what a producer that does not
    /// send the member means) when every curve was fitted.
    /// </summary>
    public bool Provisional { get; init; }

    /// <summary>Why the figures are provisional, one reason per bond valued on a stand-in; null when not provisional.</summary>
    public IReadOnlyList<string>? ProvisionalReasons { get; init; }
}
