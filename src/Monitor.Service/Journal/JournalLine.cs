using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Monitor.Analytics.Market;
using Monitor.Service.Engine;
using Monitor.Service.Storage;

namespace Monitor.Service.Journal;

/// <summary>
/// Writes and reads one line of the journal format trade-journal/2 (see README.md in this folder): a JSON object
/// <c>{"format","seq","kind","writtenTime","trade"|"quote"|"instrument","prevMac","mac"}</c> where <c>mac</c> is the HMAC-SHA256
/// (RFC 2104) under the record key of the line with the <c>,"mac":"…"</c> member cut out, and <c>prevMac</c> the mac of
/// the line before in the same day file (64 zeros for the first). The MAC is over bytes, so a reader never re-serialises.
/// </summary>
internal static class JournalLine
{
    /// <summary>The format id, first member of every line.</summary>
    public const string FormatId = "trade-journal/2";

    /// <summary>prevMac of a day file's first line: 64 zeros.</summary>
    public static readonly string Genesis = new('0', 64);

    /// <summary>Length of the MAC suffix <c>,"mac":"</c> + 64 hex + <c>"}</c>.</summary>
    public const int SuffixLength = 8 + 64 + 2;

    private static readonly byte[] SuffixStart = ",\"mac\":\""u8.ToArray();

    public static byte[] Trade(RecordKey key, long seq, DateTimeOffset writtenTime, TradeInput trade, string prevMac) =>
        Build(key, seq, "trade", writtenTime, prevMac, w =>
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

    public static byte[] Quote(RecordKey key, long seq, DateTimeOffset writtenTime, BondQuote quote, string prevMac) =>
        Build(key, seq, "quote", writtenTime, prevMac, w =>
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
    public static byte[] Definition(RecordKey key, long seq, DateTimeOffset writtenTime, Analytics.Instruments.Bond bond, string prevMac) =>
        Build(key, seq, "instrument", writtenTime, prevMac, w =>
        {
            w.WriteStartObject("instrument");
            BondTerms.Write(w, bond);
            w.WriteEndObject();
        });

    /// <summary>
    /// Reads one line (without its LF) and checks its MAC under <paramref name="key"/>. Returns null and a reason when the
    /// line cannot be used; <paramref name="tradeId"/> is the line's trade id whenever it can be read, even from a bad line.
    /// </summary>
    public static JournalRecord? Parse(RecordKey key, ReadOnlySpan<byte> line, out JournalProblemKind? problem, out string detail, out string? tradeId)
    {
        problem = null;
        detail = string.Empty;
        tradeId = TryReadTradeId(line);
        if (line.Length <= SuffixLength || !line[^SuffixLength..].StartsWith(SuffixStart) || line[^2] != (byte)'"' || line[^1] != (byte)'}')
        {
            problem = JournalProblemKind.Unparsable;
            detail = "the line does not end with the ,\"mac\":\"<64 hex>\"} member.";
            return null;
        }
        var stored = Encoding.ASCII.GetString(line[^(SuffixLength - SuffixStart.Length)..^2]);
        var computed = MacOf(key, line[..^SuffixLength]);
        if (!RecordKey.SameMac(stored, computed))
        {
            problem = JournalProblemKind.MacMismatch;
            detail = $"stored mac {Short(stored)} but HMAC-SHA256 under the record key from {key.Source} gives {Short(computed)}: the line was written or changed without the key (or the key is not the journal's).";
            return null;
        }
        try
        {
            using var doc = JsonDocument.Parse(line.ToArray());
            var root = doc.RootElement;
            if (root.GetProperty("format").GetString() != FormatId)
            {
                throw new FormatException($"format is {root.GetProperty("format").GetRawText()}, expected \"{FormatId}\".");
            }
            var prevMac = Text(root, "prevMac");
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
                    return new JournalRecord(seq, written, trade, null) { PrevMac = prevMac, Mac = stored };
                case "quote":
                    var q = root.GetProperty("quote");
                    var quote = new BondQuote(Text(q, "instrumentId"), ReadTime(q, "quoteTime"), Optional(q, "bid"), Optional(q, "ask"),
                        Optional(q, "mid"), Optional(q, "yield"), q.TryGetProperty("source", out var s) ? s.GetString() : null);
                    return new JournalRecord(seq, written, null, quote) { PrevMac = prevMac, Mac = stored };
                case "instrument":
                    return new JournalRecord(seq, written, null, null, BondTerms.Read(root.GetProperty("instrument"))) { PrevMac = prevMac, Mac = stored };
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

    /// <summary>Lowercase hex HMAC-SHA256 of the canonical bytes: the line without its mac member, closed by <c>}</c>.</summary>
    public static string MacOf(RecordKey key, ReadOnlySpan<byte> lineWithoutSuffix)
    {
        var canonical = new byte[lineWithoutSuffix.Length + 1];
        lineWithoutSuffix.CopyTo(canonical);
        canonical[^1] = (byte)'}';
        return key.Mac(canonical);
    }

    /// <summary>The mac stored in a line this class built (with its LF).</summary>
    public static string MacIn(byte[] line) => Encoding.ASCII.GetString(line, line.Length - 1 - 2 - 64, 64);

    private static string? TryReadTradeId(ReadOnlySpan<byte> line)
    {
        try
        {
            using var doc = JsonDocument.Parse(line.ToArray());
            return doc.RootElement.TryGetProperty("trade", out var t) && t.TryGetProperty("tradeId", out var id) ? id.GetString() : null;
        }
        catch (Exception ex) when (ex is JsonException or InvalidOperationException)
        {
            return null;
        }
    }

    private static byte[] Build(RecordKey key, long seq, string kind, DateTimeOffset writtenTime, string prevMac, Action<Utf8JsonWriter> body)
    {
        var buffer = new ArrayBufferWriter<byte>(256);
        using (var w = new Utf8JsonWriter(buffer))
        {
            w.WriteStartObject();
            w.WriteString("format", FormatId);
            w.WriteNumber("seq", seq);
            w.WriteString("kind", kind);
            w.WriteString("writtenTime", writtenTime.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture));
            body(w);
            w.WriteString("prevMac", prevMac);
            w.WriteEndObject();
        }
        var canonical = buffer.WrittenSpan;
        var hash = key.Mac(canonical);
        // The line: canonical bytes with the closing '}' replaced by ,"mac":"<mac>"} and a LF.
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
