using System.Globalization;
using System.Text;
using Monitor.Service.Engine;

namespace Monitor.Service.Tests.Fuzz;

/// <summary>
/// A text image of everything a message can change in a <see cref="RiskEngine"/>: instruments and their terms,
/// curves (version, dirty flag, latest quotes), books (positions, exposures), the trade register for the given
/// ids, and every limit's status. Two equal fingerprints mean no observable state changed.
/// </summary>
internal static class EngineFingerprint
{
    private static readonly Dictionary<string, string> LongStrings = new(ReferenceEqualityComparer.Instance);
    public static string Of(RiskEngine engine, IEnumerable<string> tradeIds)
    {
        var sb = new StringBuilder();
        foreach (var bond in engine.Instruments.Values.OrderBy(b => b.Id, StringComparer.Ordinal))
        {
            sb.Append(CultureInfo.InvariantCulture, $"I|{S(bond.Id)}|{S(bond.Issuer)}|{S(bond.SpreadGroup)}|{S(bond.Currency)}|{bond.CouponRate}|{bond.Frequency}|{bond.DayCount}|{bond.IssueDate}|{bond.FirstCouponDate}|{bond.MaturityDate}|{bond.Face}|{bond.SettlementLagDays}\n");
        }
        foreach (var curve in engine.Curves.Values.OrderBy(c => c.Key, StringComparer.Ordinal))
        {
            sb.Append(CultureInfo.InvariantCulture, $"C|{S(curve.Key)}|v{curve.Version}|{curve.Dirty}|{curve.LastFitRejected}\n");
            foreach (var q in curve.LatestQuotes.Values.OrderBy(q => q.Bond.Id, StringComparer.Ordinal))
            {
                sb.Append(CultureInfo.InvariantCulture, $"Q|{S(q.Bond.Id)}|{q.Quote.QuoteTime:O}|{R(q.CleanPrice)}|{R(q.Yield)}\n");
            }
        }
        foreach (var book in engine.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal))
        {
            sb.Append(CultureInfo.InvariantCulture, $"B|{book.Id}|{book.UpdatedAt:O}\n");
            foreach (var (id, face) in book.Positions.OrderBy(p => p.Key, StringComparer.Ordinal))
            {
                sb.Append(CultureInfo.InvariantCulture, $"P|{S(id)}|{R(face)}\n");
            }
            foreach (var (measure, value) in book.Exposures?.Totals.OrderBy(t => t.Key) ?? Enumerable.Empty<KeyValuePair<Limits.ExposureMeasure, double>>())
            {
                sb.Append(CultureInfo.InvariantCulture, $"E|{measure}|{R(value)}\n");
            }
        }
        sb.Append(CultureInfo.InvariantCulture, $"T|{engine.Trades.Count}\n");
        foreach (var id in tradeIds)
        {
            // Not the id itself: oversized ids (1M characters) would make every fingerprint megabytes long.
            var t = engine.Trades.Latest(id);
            sb.Append(CultureInfo.InvariantCulture, $"T|{id.Length}|{t?.Version}|{t?.Action}|{S(t?.Book)}|{S(t?.InstrumentId)}|{R(t?.FaceAmount ?? 0)}|{R(t?.CleanPrice ?? 0)}|{t?.TradeTime:O}\n");
        }
        foreach (var limit in engine.Limits.Limits.OrderBy(l => l.Id, StringComparer.Ordinal))
        {
            sb.Append(CultureInfo.InvariantCulture, $"L|{limit.Id}|{engine.Limits.StatusOf(limit.Id)}\n");
        }
        return sb.ToString();
    }

    /// <summary>Long strings (oversized ids) by length and hash: full copies would make each fingerprint megabytes long.</summary>
    private static string? S(string? text)
    {
        if (text is not { Length: > 128 })
        {
            return text;
        }
        // Cached by reference: the engine keeps the same string instances, and hashing 100k characters each time is slow.
        lock (LongStrings)
        {
            if (!LongStrings.TryGetValue(text, out var shortForm))
            {
                LongStrings[text] = shortForm = string.Create(CultureInfo.InvariantCulture, $"{text[..16]}..({text.Length}#{text.GetHashCode(StringComparison.Ordinal)})");
            }
            return shortForm;
        }
    }

    private static string R(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
