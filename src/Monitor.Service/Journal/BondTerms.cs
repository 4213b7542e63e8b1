using System.Globalization;
using System.Text.Json;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;

namespace Monitor.Service.Journal;

/// <summary>
/// A bond's full reference data as JSON, the same members in the journal's <c>instrument</c> line and the exposure
/// log's <c>instrument-defined</c> record: <c>instrumentId, issuer, spreadGroup, currency, couponRate, frequency,
/// dayCount, issueDate, firstCouponDate, maturityDate, face, settlementLagDays</c>. Rates are decimals; dates
/// <c>yyyy-MM-dd</c>; decimals are written exactly (System.Text.Json writes a decimal's digits as they are).
/// </summary>
public static class BondTerms
{
    public static void Write(Utf8JsonWriter w, Bond bond)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(bond);
        foreach (var (name, value) in ToDictionary(bond))
        {
            switch (value)
            {
                case null:
                    w.WriteNull(name);
                    break;
                case string text:
                    w.WriteString(name, text);
                    break;
                case decimal number:
                    w.WriteNumber(name, number);
                    break;
                case int number:
                    w.WriteNumber(name, number);
                    break;
            }
        }
    }

    /// <summary>The members in their order, for a log payload.</summary>
    public static IReadOnlyList<KeyValuePair<string, object?>> ToDictionary(Bond bond)
    {
        ArgumentNullException.ThrowIfNull(bond);
        return
        [
            new("instrumentId", bond.Id),
            new("issuer", bond.Issuer),
            new("spreadGroup", bond.SpreadGroup),
            new("currency", bond.Currency),
            new("couponRate", bond.CouponRate),
            new("frequency", bond.Frequency),
            new("dayCount", DayCounters.Name(bond.DayCount)),
            new("issueDate", Day(bond.IssueDate)),
            new("firstCouponDate", bond.FirstCouponDate is { } f ? Day(f) : null),
            new("maturityDate", Day(bond.MaturityDate)),
            new("face", bond.Face),
            new("settlementLagDays", bond.SettlementLagDays),
        ];
    }

    /// <summary>Reads the members back; throws <see cref="FormatException"/>, <see cref="KeyNotFoundException"/> or <see cref="ArgumentException"/> (the bond's own checks) when they do not make a bond.</summary>
    public static Bond Read(JsonElement e)
    {
        var spread = e.GetProperty("spreadGroup");
        var first = e.GetProperty("firstCouponDate");
        return new Bond(
            Text(e, "instrumentId"), Text(e, "issuer"), spread.ValueKind == JsonValueKind.Null ? null : spread.GetString(), Text(e, "currency"),
            e.GetProperty("couponRate").GetDecimal(), e.GetProperty("frequency").GetInt32(), DayCounters.Parse(Text(e, "dayCount")),
            ParseDay(Text(e, "issueDate")), first.ValueKind == JsonValueKind.Null ? null : ParseDay(first.GetString() ?? string.Empty),
            ParseDay(Text(e, "maturityDate")), e.GetProperty("face").GetDecimal(), e.GetProperty("settlementLagDays").GetInt32());
    }

    /// <summary>Every member equal (terms, issuer, currency and settlement lag).</summary>
    public static bool Same(Bond a, Bond b) => ToDictionary(a).SequenceEqual(ToDictionary(b));

    private static string Text(JsonElement e, string name) =>
        e.GetProperty(name).GetString() ?? throw new FormatException($"'{name}' is null.");

    private static string Day(DateOnly day) => day.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    private static DateOnly ParseDay(string text) => DateOnly.ParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture);
}
