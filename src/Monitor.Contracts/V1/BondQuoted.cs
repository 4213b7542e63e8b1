namespace Monitor.Contracts.V1;

/// <summary>
/// Inbound: a price or yield quote for one bond. Give bid and ask, or mid, as clean prices per 100
/// face; or a yield (decimal, street convention at the bond's coupon frequency). At least one of
/// them must be present. Wire identity: <c>Monitor.Contracts.V1.BondQuoted</c>.
/// </summary>
public sealed record BondQuoted
{
    /// <summary>Unique id of the quote; fit reports name the quotes they used by it.</summary>
    public required string QuoteId { get; init; }

    public required string InstrumentId { get; init; }

    /// <summary>Clean bid price per 100 face.</summary>
    public double? BidCleanPrice { get; init; }

    /// <summary>Clean ask price per 100 face.</summary>
    public double? AskCleanPrice { get; init; }

    /// <summary>Clean mid price per 100 face.</summary>
    public double? MidCleanPrice { get; init; }

    /// <summary>Yield to maturity, decimal (0.0312 = 3.12%).</summary>
    public double? Yield { get; init; }

    public required DateTimeOffset QuoteTime { get; init; }

    /// <summary>Who published the quote (a venue or feed name of your own).</summary>
    public required string Source { get; init; }
}
