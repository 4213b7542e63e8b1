using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// The exposure-log/2 line format (Audit/README.md): canonical bytes, MAC, and reading a line back.
/// Canonical bytes = the record object without "mac", members in the order format, seq, kind, eventTime,
/// writtenTime, cause{id,type}, payload, prevMac, written by System.Text.Json's Utf8JsonWriter
/// without whitespace and with its default encoder (every non-ASCII character escaped, so lines are ASCII).
/// mac = HMAC-SHA256 (RFC 2104) of the canonical bytes under the record key.
/// The line = canonical bytes with the closing brace replaced by <c>,"mac":"&lt;hex&gt;"}</c>.
/// </summary>
internal static class ExposureLogLine
{
    /// <summary>The format id, first member of every line: a descriptive name of our own and its version.</summary>
    public const string FormatId = "exposure-log/2";

    private const string TimeFormat = "yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'";
    private const string MacMemberStart = ",\"mac\":\"";

    // ,"mac":" + 64 hex + "}
    private static readonly int MacSuffixLength = MacMemberStart.Length + 64 + 2;

    private static readonly string[] MemberOrder = ["format", "seq", "kind", "eventTime", "writtenTime", "cause", "payload", "prevMac", "mac"];

    public static string FormatTime(DateTimeOffset time) => time.UtcDateTime.ToString(TimeFormat, CultureInfo.InvariantCulture);

    /// <summary>Builds the record; the payload must be a JSON object.</summary>
    public static ExposureLogRecord Build(
        RecordKey key, long seq, string kind, DateTimeOffset eventTime, DateTimeOffset writtenTime, ExposureLogCause cause, JsonElement payload, string prevMac)
    {
        var buffer = new ArrayBufferWriter<byte>(512);
        using (var writer = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = false }))
        {
            writer.WriteStartObject();
            writer.WriteString("format", FormatId);
            writer.WriteNumber("seq", seq);
            writer.WriteString("kind", kind);
            writer.WriteString("eventTime", FormatTime(eventTime));
            writer.WriteString("writtenTime", FormatTime(writtenTime));
            writer.WriteStartObject("cause");
            writer.WriteString("id", cause.MessageId);
            writer.WriteString("type", cause.MessageType);
            writer.WriteEndObject();
            writer.WritePropertyName("payload");
            payload.WriteTo(writer);
            writer.WriteString("prevMac", prevMac);
            writer.WriteEndObject();
        }

        var canonical = buffer.WrittenSpan;
        var mac = key.Mac(canonical);
        var line = Encoding.UTF8.GetString(canonical[..^1]) + MacMemberStart + mac + "\"}";
        return new ExposureLogRecord(
            seq, kind, eventTime.ToUniversalTime(), writtenTime.ToUniversalTime(), cause, payload.Clone(), prevMac, mac, line);
    }

    /// <summary>Reads a line (without its line feed) back into a record and checks its MAC under <paramref name="key"/>.</summary>
    public static ParsedLine Parse(RecordKey key, ReadOnlySpan<byte> line)
    {
        if (line.Length <= MacSuffixLength
            || !line[^MacSuffixLength..].StartsWith(Encoding.ASCII.GetBytes(MacMemberStart))
            || !line.EndsWith("\"}"u8))
        {
            return Unparsable("the line does not end with the member ,\"mac\":\"<64 hex digits>\"}");
        }

        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(line.ToArray());
        }
        catch (JsonException ex)
        {
            return Unparsable("invalid JSON: " + ex.Message);
        }

        using (document)
        {
            try
            {
                var record = ReadRecord(document.RootElement, line);
                var canonical = new byte[line.Length - MacSuffixLength + 1];
                line[..^MacSuffixLength].CopyTo(canonical);
                canonical[^1] = (byte)'}';
                var computed = key.Mac(canonical);
                return new ParsedLine(record, null, RecordKey.SameMac(computed, record.Mac), computed);
            }
            catch (Exception ex) when (ex is FormatException or InvalidOperationException)
            {
                // InvalidOperationException: a string member holds bytes that are not UTF-8.
                return Unparsable(ex.Message);
            }
        }
    }

    private static ParsedLine Unparsable(string error) => new(null, error, false, null);

    private static ExposureLogRecord ReadRecord(JsonElement root, ReadOnlySpan<byte> line)
    {
        if (root.ValueKind != JsonValueKind.Object)
        {
            throw new FormatException($"the line is a JSON {root.ValueKind}, not an object");
        }

        var names = root.EnumerateObject().Select(p => p.Name).ToArray();
        if (!names.SequenceEqual(MemberOrder, StringComparer.Ordinal))
        {
            throw new FormatException($"members are [{string.Join(",", names)}], expected [{string.Join(",", MemberOrder)}]");
        }

        var format = root.GetProperty("format");
        if (format.ValueKind != JsonValueKind.String || format.GetString() != FormatId)
        {
            throw new FormatException($"format is {format.GetRawText()}, expected \"{FormatId}\"");
        }

        var seqElement = root.GetProperty("seq");
        if (seqElement.ValueKind != JsonValueKind.Number || !seqElement.TryGetInt64(out var seq) || seq < 1)
        {
            throw new FormatException($"seq is {seqElement.GetRawText()}, expected a whole number >= 1");
        }

        var cause = root.GetProperty("cause");
        if (cause.ValueKind != JsonValueKind.Object
            || !cause.EnumerateObject().Select(p => p.Name).SequenceEqual(["id", "type"], StringComparer.Ordinal))
        {
            throw new FormatException($"cause is {cause.GetRawText()}, expected {{\"id\":..,\"type\":..}}");
        }

        var payload = root.GetProperty("payload");
        if (payload.ValueKind != JsonValueKind.Object)
        {
            throw new FormatException($"payload is a JSON {payload.ValueKind}, expected an object");
        }

        var prevMac = String(root, "prevMac");
        var mac = String(root, "mac");
        if (!ExposureLogMac.IsWellFormed(prevMac) || !ExposureLogMac.IsWellFormed(mac))
        {
            throw new FormatException("prevMac and mac must be 64 lowercase hex digits");
        }

        var idElement = cause.GetProperty("id");
        string? id = idElement.ValueKind switch
        {
            JsonValueKind.Null => null,
            JsonValueKind.String => idElement.GetString(),
            _ => throw new FormatException($"cause.id is {idElement.GetRawText()}, expected a string or null"),
        };

        return new ExposureLogRecord(
            seq,
            String(root, "kind"),
            Time(root, "eventTime"),
            Time(root, "writtenTime"),
            new ExposureLogCause(id, String(cause, "type")),
            payload.Clone(),
            prevMac,
            mac,
            Encoding.UTF8.GetString(line));
    }

    private static string String(JsonElement parent, string name)
    {
        var element = parent.GetProperty(name);
        return element.ValueKind == JsonValueKind.String
            ? element.GetString()!
            : throw new FormatException($"{name} is {element.GetRawText()}, expected a string");
    }

    private static DateTimeOffset Time(JsonElement parent, string name)
    {
        var text = String(parent, name);
        return DateTimeOffset.TryParseExact(
            text, TimeFormat, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal, out var time)
            ? time
            : throw new FormatException($"{name} is \"{text}\", expected {TimeFormat}");
    }
}
