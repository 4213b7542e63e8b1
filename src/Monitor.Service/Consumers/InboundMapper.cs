using System.Globalization;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;

namespace Monitor.Service.Consumers;

/// <summary>
/// Turns inbound contract messages into validated domain values. Every failure is a
/// <see cref="MessageRejectedException"/> naming the message field (camelCase, as on the wire) and its value.
/// </summary>
public static class InboundMapper
{
    private static readonly Dictionary<string, string> BondFieldToWire = new(StringComparer.Ordinal)
    {
        ["Id"] = "instrumentId",
        ["Issuer"] = "issuer",
        ["SpreadGroup"] = "spreadGroup",
        ["Currency"] = "currency",
        ["CouponRate"] = "couponRate",
        ["Frequency"] = "frequency",
        ["DayCount"] = "dayCount",
        ["IssueDate"] = "issueDate",
        ["FirstCouponDate"] = "firstCouponDate",
        ["MaturityDate"] = "maturityDate",
        ["Face"] = "face",
        ["SettlementLagDays"] = "settlementLagDays",
    };

    private static readonly Dictionary<string, string> QuoteFieldToWire = new(StringComparer.Ordinal)
    {
        ["instrumentId"] = "instrumentId",
        ["bid"] = "bidCleanPrice",
        ["ask"] = "askCleanPrice",
        ["mid"] = "midCleanPrice",
        ["yield"] = "yield",
    };

    /// <summary>Longest id (instrument, trade, book) accepted; longer text is a producer's bug, not an id.</summary>
    public const int MaxIdLength = 64;

    /// <summary>Longest free text (issuer, source) accepted.</summary>
    public const int MaxTextLength = 256;

    public static Bond ToBond(InstrumentDefined m)
    {
        ArgumentNullException.ThrowIfNull(m);
        Length("instrumentId", m.InstrumentId, MaxIdLength);
        Length("issuer", m.Issuer, MaxTextLength);
        Length("spreadGroup", m.SpreadGroup, MaxIdLength);
        Length("currency", m.Currency, 3);
        if (!DayCounters.TryParse(m.DayCount, out var dayCount))
        {
            throw new MessageRejectedException("dayCount", m.DayCount, "is not a day count; use ACT/ACT-ICMA, ACT/ACT-ISDA, 30/360, 30E/360, ACT/360 or ACT/365F.");
        }
        if (!double.IsFinite(m.CouponRate) || !double.IsFinite(m.Face))
        {
            var field = double.IsFinite(m.CouponRate) ? "face" : "couponRate";
            throw new MessageRejectedException(field, Text(field == "face" ? m.Face : m.CouponRate), "must be a finite number.");
        }
        try
        {
            return new Bond(m.InstrumentId, m.Issuer, string.IsNullOrWhiteSpace(m.SpreadGroup) ? null : m.SpreadGroup, m.Currency,
                (decimal)m.CouponRate, m.Frequency, dayCount, m.IssueDate, m.FirstCouponDate, m.MaturityDate, (decimal)m.Face, m.SettlementLagDays);
        }
        catch (ArgumentException ex)
        {
            var field = ex.ParamName is { } p && BondFieldToWire.TryGetValue(p, out var wire) ? wire : "instrumentId";
            // "Bond 'X': Frequency = 3 must be 0 (zero coupon), 1, 2, 4 or 12." -> "frequency = 3 must be ..."
            var reason = RefusalText.Plain(ex, BondFieldToWire);
            var prefix = $"Bond '{m.InstrumentId}': ";
            throw new MessageRejectedException(field, null, reason.StartsWith(prefix, StringComparison.Ordinal) ? reason[prefix.Length..] : reason);
        }
        catch (OverflowException)
        {
            throw new MessageRejectedException("couponRate", Text(m.CouponRate), "is too large; use a decimal rate between 0 and 1 (0.05 = 5%).");
        }
    }

    public static BondQuote ToQuote(BondQuoted m)
    {
        ArgumentNullException.ThrowIfNull(m);
        Length("instrumentId", m.InstrumentId, MaxIdLength);
        Length("quoteId", m.QuoteId, MaxIdLength);
        Length("source", m.Source, MaxTextLength);
        Price("bidCleanPrice", m.BidCleanPrice);
        Price("askCleanPrice", m.AskCleanPrice);
        Price("midCleanPrice", m.MidCleanPrice);
        if (m.Yield is { } y && (!double.IsFinite(y) || y < BondQuote.MinYield || y > BondQuote.MaxYield))
        {
            throw new MessageRejectedException("yield", Text(y),
                $"is outside [{Text(BondQuote.MinYield)}, {Text(BondQuote.MaxYield)}]; yields are decimals (0.05 = 5%).");
        }
        if (m.BidCleanPrice is { } bid && m.AskCleanPrice is { } ask && bid > ask)
        {
            throw new MessageRejectedException("bidCleanPrice", Text(bid), $"is above askCleanPrice {Text(ask)}.");
        }
        if (m.MidCleanPrice is null && m.Yield is null && (m.BidCleanPrice is null || m.AskCleanPrice is null))
        {
            throw new MessageRejectedException("midCleanPrice", null, "is missing; give midCleanPrice, bidCleanPrice and askCleanPrice, or yield.");
        }
        try
        {
            return new BondQuote(m.InstrumentId, m.QuoteTime, m.BidCleanPrice, m.AskCleanPrice, m.MidCleanPrice, m.Yield, m.Source);
        }
        catch (ArgumentException ex)
        {
            var field = ex.ParamName is { } p && QuoteFieldToWire.TryGetValue(p, out var wire) ? wire : "midCleanPrice";
            double? value = field switch
            {
                "bidCleanPrice" => m.BidCleanPrice,
                "askCleanPrice" => m.AskCleanPrice,
                "yield" => m.Yield,
                _ => m.MidCleanPrice,
            };
            throw new MessageRejectedException(field, field == "instrumentId" ? m.InstrumentId : value is { } v ? Text(v) : null, RefusalText.Plain(ex, QuoteFieldToWire));
        }
    }

    public static TradeInput ToTrade(TradeBooked m)
    {
        ArgumentNullException.ThrowIfNull(m);
        Length("tradeId", m.TradeId, MaxIdLength);
        Length("book", m.Book, MaxIdLength);
        Length("instrumentId", m.InstrumentId, MaxIdLength);
        if (string.IsNullOrWhiteSpace(m.TradeId))
        {
            throw new MessageRejectedException("tradeId", m.TradeId, "is blank.");
        }
        if (m.Version < 1)
        {
            throw new MessageRejectedException("version", Text(m.Version), "must be 1 or more.");
        }
        var action = m.Action?.Trim().ToLowerInvariant() switch
        {
            "new" => TradeAction.New,
            "amend" => TradeAction.Amend,
            "cancel" => TradeAction.Cancel,
            _ => throw new MessageRejectedException("action", m.Action, "is not an action; use new, amend or cancel."),
        };
        if (string.IsNullOrWhiteSpace(m.Book))
        {
            throw new MessageRejectedException("book", m.Book, "is blank.");
        }
        if (string.IsNullOrWhiteSpace(m.InstrumentId))
        {
            throw new MessageRejectedException("instrumentId", m.InstrumentId, "is blank.");
        }
        return new TradeInput(m.TradeId, m.Version, action, m.Book, m.InstrumentId, m.FaceAmount, m.CleanPrice, m.TradeTime);
    }

    /// <summary>The points of a par-yield message as (tenor, decimal par yield); the engine checks tenors and ranges.</summary>
    public static IReadOnlyList<(string Tenor, double ParYield)> ToParYields(ParYieldsPublished m)
    {
        ArgumentNullException.ThrowIfNull(m);
        if (string.IsNullOrWhiteSpace(m.CurveId))
        {
            throw new MessageRejectedException("curveId", m.CurveId, "is blank; use \"government\".");
        }
        if (m.Points is null || m.Points.Count == 0)
        {
            throw new MessageRejectedException("points", null, "is missing or empty; give par yields at tenors such as 1Y, 2Y, 5Y, 10Y.");
        }
        var points = new List<(string, double)>(m.Points.Count);
        for (var i = 0; i < m.Points.Count; i++)
        {
            if (m.Points[i] is not { } point || string.IsNullOrWhiteSpace(point.Tenor))
            {
                throw new MessageRejectedException($"points[{i}].tenor", m.Points[i]?.Tenor, "is missing; use a tenor such as 3M or 10Y.");
            }
            points.Add((point.Tenor.Trim(), point.ParYield));
        }
        return points;
    }

    private static void Length(string field, string? value, int max)
    {
        if (value is not null && value.Length > max)
        {
            throw new MessageRejectedException(field, value[..Math.Min(40, value.Length)] + "...", $"is {value.Length} characters long; at most {max} are accepted.");
        }
    }

    private static void Price(string field, double? price)
    {
        if (price is { } p && (!double.IsFinite(p) || p <= 0 || p > BondQuote.MaxPrice))
        {
            throw new MessageRejectedException(field, Text(p), $"is outside (0, {Text(BondQuote.MaxPrice)}] per 100 face.");
        }
    }

    private static string Text(double value) => value.ToString("G", CultureInfo.InvariantCulture);
}
