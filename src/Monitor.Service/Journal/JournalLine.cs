using System.Buffers;
using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using Monitor.Analytics.Market;
using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// Writes and reads one line of the journal format MTJ-1 (see README.md in this folder): a JSON object
/// <c>{"seq","kind","writtenTime","trade"|"quote"|"instrument","sha256"}</c> where <c>sha256</c> is the SHA-256 (FIPS 180-4)
/// of the line with the <c>,"sha256":"…"</c> member cut out. The hash is over bytes, so a reader never re-serialises.
/// </summary>
internal static class JournalLine
{
    /// <summary>Length of the hash suffix <c>,"sha256":"</c> + 64 hex + <c>"}</c>.</summary>
    public const int SuffixLength = 11 + 64 + 2;

    private static readonly byte[] SuffixStart = ",\"sha256\":\""u8.ToArray();

    public static byte[] Trade(long seq, DateTimeOffset writtenTime, TradeInput trade) =>
        Build(seq, "trade", writtenTime, w =>
        {
            w.WriteStartObject("trade");
            w.WriteString("tradeId", trade.TradeId);
            w.WriteNumber("version", trade.Version);
            w.WriteString("action", ActionName(trade.Action));
            w.WriteString("book", trade.Book);
            w.WriteString("instrumentId", trade.InstrumentId);
            w.WriteNumber("faceAmount", trade.FaceAmount);
            w.WriteNumber("cleanPrice", trade.CleanPrice);
            w.WriteString("tradeTime", Iso(trade.TradeTime));
            w.WriteEndObject();
        });

    public static byte[] Quote(long seq, DateTimeOffset writtenTime, BondQuote quote) =>
        Build(seq, "quote", writtenTime, w =>
        {
            w.WriteStartObject("quote");
            w.WriteString("instrumentId", quote.InstrumentId);
            w.WriteString("quoteTime", Iso(quote.QuoteTime));
            WriteOptional(w, "bid", quote.Bid);
            WriteOptional(w, "ask", quote.Ask);
            WriteOptional(w, "mid", quote.Mid);
            WriteOptional(w, "yield", quote.Yield);
            if (quote.Source is null)
            {
                w.WriteNull("source");
            }
            else
            {
                w.WriteString("source", quote.Source);
            }
            w.WriteEndObject();
        });

    /// <summary>An accepted instrument definition (kind <c>instrument</c>), journalled before it changes the engine.</summary>
    public static byte[] Definition(long seq, DateTimeOffset writtenTime, Analytics.Instruments.Bond bond) =>
        Build(seq, "instrument", writtenTime, w =>
        {
            w.WriteStartObject("instrument");
            BondTerms.Write(w, bond);
            w.WriteEndObject();
        });

    /// <summary>Reads one line (without its LF). Returns null and a reason when the line cannot be used.</summary>
    public static JournalRecord? Parse(ReadOnlySpan<byte> line, out JournalProblemKind? problem, out string detail)
    {
        problem = null;
        detail = string.Empty;
        if (line.Length <= SuffixLength || !line[^SuffixLength..].StartsWith(SuffixStart) || line[^2] != (byte)'"' || line[^1] != (byte)'}')
        {
            problem = JournalProblemKind.Unparsable;
            detail = "the line does not end with the ,\"sha256\":\"<64 hex>\"} member.";
            return null;
        }
        var stored = Encoding.ASCII.GetString(line[^(SuffixLength - SuffixStart.Length)..^2]);
        var computed = HashOf(line[..^SuffixLength]);
        if (!string.Equals(stored, computed, StringComparison.Ordinal))
        {
            problem = JournalProblemKind.HashMismatch;
            detail = $"stored sha256 {Short(stored)} but the bytes hash to {Short(computed)}.";
            return null;
        }
        try
        {
            using var doc = JsonDocument.Parse(line.ToArray());
            var root = doc.RootElement;
            var seq = root.GetProperty("seq").GetInt64();
            var written = ReadTime(root, "writtenTime");
            var kind = root.GetProperty("kind").GetString();
            switch (kind)
            {
                case "trade":
                    var t = root.GetProperty("trade");
                    var trade = new TradeInput(
                        Text(t, "tradeId"), t.GetProperty("version").GetInt32(), ParseAction(Text(t, "action")), Text(t, "book"),
                        Text(t, "instrumentId"), t.GetProperty("faceAmount").GetDouble(), t.GetProperty("cleanPrice").GetDouble(), ReadTime(t, "tradeTime"));
                    return new JournalRecord(seq, written, trade, null);
                case "quote":
                    var q = root.GetProperty("quote");
                    var quote = new BondQuote(Text(q, "instrumentId"), ReadTime(q, "quoteTime"), Optional(q, "bid"), Optional(q, "ask"),
                        Optional(q, "mid"), Optional(q, "yield"), q.TryGetProperty("source", out var s) ? s.GetString() : null);
                    return new JournalRecord(seq, written, null, quote);
                case "instrument":
                    return new JournalRecord(seq, written, null, null, BondTerms.Read(root.GetProperty("instrument")));
                default:
                    problem = JournalProblemKind.Unparsable;
                    detail = $"kind '{kind}' is not 'trade', 'quote' or 'instrument'.";
                    return null;
            }
        }
        catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException or FormatException or ArgumentException)
        {
            problem = JournalProblemKind.Unparsable;
            detail = ex.Message;
            return null;
        }
    }

    /// <summary>Lowercase hex SHA-256 of the canonical bytes: the line without its hash member, closed by <c>}</c>.</summary>
    public static string HashOf(ReadOnlySpan<byte> lineWithoutSuffix)
    {
        var canonical = new byte[lineWithoutSuffix.Length + 1];
        lineWithoutSuffix.CopyTo(canonical);
        canonical[^1] = (byte)'}';
        return Convert.ToHexStringLower(SHA256.HashData(canonical));
    }

    private static byte[] Build(long seq, string kind, DateTimeOffset writtenTime, Action<Utf8JsonWriter> body)
    {
        var buffer = new ArrayBufferWriter<byte>(256);
        using (var w = new Utf8JsonWriter(buffer))
        {
            w.WriteStartObject();
            w.WriteNumber("seq", seq);
            w.WriteString("kind", kind);
            w.WriteString("writtenTime", writtenTime.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture));
            body(w);
            w.WriteEndObject();
        }
        var canonical = buffer.WrittenSpan;
        var hash = Convert.ToHexStringLower(SHA256.HashData(canonical));
        // The line: canonical bytes with the closing '}' replaced by ,"sha256":"<hash>"} and a LF.
        var line = new byte[canonical.Length - 1 + SuffixLength + 1];
        canonical[..^1].CopyTo(line);
        var at = canonical.Length - 1;
        SuffixStart.CopyTo(line, at);
        at += SuffixStart.Length;
        Encoding.ASCII.GetBytes(hash, 0, hash.Length, line, at);
        at += hash.Length;
        line[at++] = (byte)'"';
        line[at++] = (byte)'}';
        line[at] = (byte)'\n';
        return line;
    }

    private static void WriteOptional(Utf8JsonWriter w, string name, double? value)
    {
        if (value is { } v)
        {
            w.WriteNumber(name, v);
        }
        else
        {
            w.WriteNull(name);
        }
    }

    private static double? Optional(JsonElement e, string name) =>
        e.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null ? v.GetDouble() : null;

    private static string Text(JsonElement e, string name) =>
        e.GetProperty(name).GetString() ?? throw new FormatException($"'{name}' is null.");

    private static DateTimeOffset ReadTime(JsonElement e, string name) =>
        DateTimeOffset.Parse(Text(e, name), CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind);

    private static string ActionName(TradeAction action) => action switch
    {
        TradeAction.New => "new",
        TradeAction.Amend => "amend",
        TradeAction.Cancel => "cancel",
        _ => throw new ArgumentOutOfRangeException(nameof(action), action, "Unknown trade action."),
    };

    private static TradeAction ParseAction(string text) => text switch
    {
        "new" => TradeAction.New,
        "amend" => TradeAction.Amend,
        "cancel" => TradeAction.Cancel,
        _ => throw new FormatException($"action '{text}' is not new, amend or cancel."),
    };

    private static string Iso(DateTimeOffset time) => time.ToString("O", CultureInfo.InvariantCulture);

    private static string Short(string hash) => hash.Length > 12 ? hash[..12] + "…" : hash;
}
