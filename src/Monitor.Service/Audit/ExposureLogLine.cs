using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Json;

namespace Monitor.Service.Audit;

/// <summary>
/// The MXL-1 line format (Audit/README.md): canonical bytes, hash, and reading a line back.
/// Canonical bytes = the record object without "hash", members in the order v, seq, kind, eventTime,
/// writtenTime, cause{id,type}, payload, prevHash, written by System.Text.Json's Utf8JsonWriter
/// without whitespace and with its default encoder (every non-ASCII character escaped, so lines are ASCII).
/// The line = canonical bytes with the closing brace replaced by <c>,"hash":"&lt;hex&gt;"}</c>.
/// </summary>
internal static class ExposureLogLine
{
    public const int FormatVersion = 1;

    private const string TimeFormat = "yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'";
    private const string HashMemberStart = ",\"hash\":\"";

    // ,"hash":" + 64 hex + "}
    private static readonly int HashSuffixLength = HashMemberStart.Length + 64 + 2;

    private static readonly string[] MemberOrder = ["v", "seq", "kind", "eventTime", "writtenTime", "cause", "payload", "prevHash", "hash"];

    public static string FormatTime(DateTimeOffset time) => time.UtcDateTime.ToString(TimeFormat, CultureInfo.InvariantCulture);

    /// <summary>Builds the record; the payload must be a JSON object.</summary>
    public static ExposureLogRecord Build(
        long seq, string kind, DateTimeOffset eventTime, DateTimeOffset writtenTime, ExposureLogCause cause, JsonElement payload, string prevHash)
    {
        var buffer = new ArrayBufferWriter<byte>(512);
        using (var writer = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = false }))
        {
            writer.WriteStartObject();
            writer.WriteNumber("v", FormatVersion);
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
            writer.WriteString("prevHash", prevHash);
            writer.WriteEndObject();
        }

        var canonical = buffer.WrittenSpan;
        var hash = ExposureLogHash.Compute(canonical);
        var line = Encoding.UTF8.GetString(canonical[..^1]) + HashMemberStart + hash + "\"}";
        return new ExposureLogRecord(
            seq, kind, eventTime.ToUniversalTime(), writtenTime.ToUniversalTime(), cause, payload.Clone(), prevHash, hash, line);
    }

    /// <summary>Reads a line (without its line feed) back into a record and checks its hash.</summary>
    public static ParsedLine Parse(ReadOnlySpan<byte> line)
    {
        if (line.Length <= HashSuffixLength
            || !line[^HashSuffixLength..].StartsWith(Encoding.ASCII.GetBytes(HashMemberStart))
            || !line.EndsWith("\"}"u8))
        {
            return Unparsable("the line does not end with the member ,\"hash\":\"<64 hex digits>\"}");
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
                var canonical = new byte[line.Length - HashSuffixLength + 1];
                line[..^HashSuffixLength].CopyTo(canonical);
                canonical[^1] = (byte)'}';
                var computed = ExposureLogHash.Compute(canonical);
                return new ParsedLine(record, null, string.Equals(computed, record.Hash, StringComparison.Ordinal), computed);
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

        var version = root.GetProperty("v");
        if (version.ValueKind != JsonValueKind.Number || !version.TryGetInt32(out var v) || v != FormatVersion)
        {
            throw new FormatException($"v is {version.GetRawText()}, expected {FormatVersion}");
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

        var prevHash = String(root, "prevHash");
        var hash = String(root, "hash");
        if (!ExposureLogHash.IsWellFormed(prevHash) || !ExposureLogHash.IsWellFormed(hash))
        {
            throw new FormatException("prevHash and hash must be 64 lowercase hex digits");
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
            prevHash,
            hash,
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
