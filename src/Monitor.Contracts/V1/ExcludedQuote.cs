namespace Monitor.Contracts.V1;

/// <summary>A quote left out of a fit, with the reason (e.g. "stale: 42 min old", "outlier: residual 38.2 bp").</summary>
public sealed record ExcludedQuote
{
    public required string QuoteId { get; init; }

    public required string Reason { get; init; }
}
