using System.Globalization;

namespace Monitor.Analytics.Market;

/// <summary>
/// A quote for one bond: clean prices per 100 face (bid/ask or mid), or a yield (decimal, street convention).
/// At least one of a mid, a bid/ask pair or a yield is required. Validated on construction.
/// </summary>
public sealed record BondQuote
{
    /// <summary>Prices per 100 face outside (0, MaxPrice] are treated as bad data, not as quotes.</summary>
    public const double MaxPrice = 1000.0;

    /// <summary>Yields outside [MinYield, MaxYield] are treated as bad data (decimals: -20% .. 100%).</summary>
    public const double MinYield = -0.20;

    public const double MaxYield = 1.0;

    public BondQuote(string instrumentId, DateTimeOffset quoteTime, double? bid, double? ask, double? mid, double? yield, string? source)
    {
        if (string.IsNullOrWhiteSpace(instrumentId))
        {
            throw new ArgumentException("Quote instrument id is blank.", nameof(instrumentId));
        }
        CheckPrice(bid, nameof(bid));
        CheckPrice(ask, nameof(ask));
        CheckPrice(mid, nameof(mid));
        if (yield is { } y && (!double.IsFinite(y) || y < MinYield || y > MaxYield))
        {
            throw new ArgumentOutOfRangeException(nameof(yield), yield,
                $"Quote yield {Format(y)} for {instrumentId} is outside [{Format(MinYield)}, {Format(MaxYield)}] (decimals: 0.05 = 5%).");
        }
        if (bid is { } b && ask is { } a && b > a)
        {
            throw new ArgumentException($"Quote for {instrumentId}: bid {Format(b)} is above ask {Format(a)}.", nameof(bid));
        }
        if (mid is null && yield is null && (bid is null || ask is null))
        {
            throw new ArgumentException($"Quote for {instrumentId} needs a mid price, a bid and an ask, or a yield.", nameof(mid));
        }
        InstrumentId = instrumentId;
        QuoteTime = quoteTime;
        Bid = bid;
        Ask = ask;
        Mid = mid;
        Yield = yield;
        Source = source;
    }

    public string InstrumentId { get; }

    public DateTimeOffset QuoteTime { get; }

    public double? Bid { get; }

    public double? Ask { get; }

    public double? Mid { get; }

    public double? Yield { get; }

    public string? Source { get; }

    /// <summary>The clean mid price per 100: the mid if given, else the bid/ask average; null when only a yield was quoted.</summary>
    public double? CleanMid => Mid ?? (Bid is { } b && Ask is { } a ? 0.5 * (b + a) : null);

    private static void CheckPrice(double? price, string name)
    {
        if (price is { } p && (!double.IsFinite(p) || p <= 0 || p > MaxPrice))
        {
            throw new ArgumentOutOfRangeException(name, price, $"Quote {name} price {Format(p)} is outside (0, {Format(MaxPrice)}] per 100 face.");
        }
    }

    private static string Format(double value) => value.ToString("G", CultureInfo.InvariantCulture);
}
