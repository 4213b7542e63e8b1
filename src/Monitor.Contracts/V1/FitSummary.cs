namespace Monitor.Contracts.V1;

/// <summary>Quality of a curve fit: errors in basis points of yield, the quotes used and those excluded.</summary>
public sealed record FitSummary
{
    /// <summary>Root-mean-square yield error over the used quotes, bp.</summary>
    public required double RmseBp { get; init; }

    /// <summary>Largest absolute yield error, bp.</summary>
    public required double MaxErrorBp { get; init; }

    public required int Iterations { get; init; }

    public required IReadOnlyList<string> UsedQuoteIds { get; init; }

    public required IReadOnlyList<ExcludedQuote> Excluded { get; init; }
}
