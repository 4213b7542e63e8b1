using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// An anchor of the exposure log kept outside its folder (format exposure-log-checkpoint/2, Audit/README.md): the
/// last record's day, seq and mac, how many records that day file held, when and why it was cut. The line carries its
/// own HMAC-SHA256 under the record key (<c>checkpointMac</c>), so a checkpoint cannot be forged without the key either.
/// </summary>
/// <param name="Day">Business day (day file) of the record anchored.</param>
/// <param name="Seq">seq of the last record in the log when the checkpoint was cut.</param>
/// <param name="Mac">mac of that record.</param>
/// <param name="DayRecords">Records in that day file up to and including <paramref name="Seq"/>.</param>
/// <param name="Time">When the checkpoint was cut (writer's clock, UTC).</param>
/// <param name="Reason"><c>interval</c>, <c>day-close</c> or <c>stop</c> (or a caller's word, <c>[a-z][a-z0-9-]*</c>).</param>
public sealed record ExposureLogCheckpoint(DateOnly Day, long Seq, string Mac, long DayRecords, DateTimeOffset Time, string Reason)
{
    /// <summary>The format id, first member of every checkpoint line.</summary>
    public const string FormatId = "exposure-log-checkpoint/2";

    private const string DayFormat = "yyyy-MM-dd";
    private const string TimeFormat = "yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'";
    private const string MacMemberStart = ",\"checkpointMac\":\"";
    private static readonly string[] MemberOrder = ["format", "day", "seq", "mac", "dayRecords", "time", "reason", "checkpointMac"];

    /// <summary>The checkpoint's line (without line feed): canonical bytes with <c>,"checkpointMac":"&lt;hex&gt;"}</c> in place of the closing brace.</summary>
    public string ToLine(RecordKey key)
    {
        ArgumentNullException.ThrowIfNull(key);
        var canonical = Canonical();
        return Encoding.UTF8.GetString(canonical[..^1]) + MacMemberStart + key.Mac(canonical) + "\"}";
    }

    /// <summary>The checkpointMac of this checkpoint under <paramref name="key"/>.</summary>
    public string MacUnder(RecordKey key)
    {
        ArgumentNullException.ThrowIfNull(key);
        return key.Mac(Canonical());
    }

    /// <summary>Reads a checkpoint line; null with the reason when it is unparsable or its checkpointMac fails under <paramref name="key"/>.</summary>
    public static ExposureLogCheckpoint? Parse(RecordKey key, string line, out string? problem)
    {
        ArgumentNullException.ThrowIfNull(key);
        ArgumentNullException.ThrowIfNull(line);
        problem = null;
        try
        {
            using var document = JsonDocument.Parse(line);
            var root = document.RootElement;
            var names = root.EnumerateObject().Select(p => p.Name).ToArray();
            if (!names.SequenceEqual(MemberOrder, StringComparer.Ordinal))
            {
                problem = $"members are [{string.Join(",", names)}], expected [{string.Join(",", MemberOrder)}]";
                return null;
            }
            if (root.GetProperty("format").GetString() != FormatId)
            {
                problem = $"format is {root.GetProperty("format").GetRawText()}, expected \"{FormatId}\"";
                return null;
            }
            var checkpoint = new ExposureLogCheckpoint(
                DateOnly.ParseExact(root.GetProperty("day").GetString()!, DayFormat, CultureInfo.InvariantCulture),
                root.GetProperty("seq").GetInt64(),
                root.GetProperty("mac").GetString()!,
                root.GetProperty("dayRecords").GetInt64(),
                DateTimeOffset.ParseExact(root.GetProperty("time").GetString()!, TimeFormat, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal),
                root.GetProperty("reason").GetString()!);
            var stored = root.GetProperty("checkpointMac").GetString()!;
            if (!string.Equals(checkpoint.ToLine(key), line, StringComparison.Ordinal) || !RecordKey.SameMac(checkpoint.MacUnder(key), stored))
            {
                problem = "its checkpointMac does not hold under the record key (a forged or changed checkpoint, or another key).";
                return null;
            }
            return checkpoint;
        }
        catch (Exception ex) when (ex is JsonException or FormatException or InvalidOperationException or KeyNotFoundException)
        {
            problem = "unparsable: " + ex.Message;
            return null;
        }
    }

    private byte[] Canonical()
    {
        var buffer = new ArrayBufferWriter<byte>(256);
        using (var writer = new Utf8JsonWriter(buffer))
        {
            writer.WriteStartObject();
            writer.WriteString("format", FormatId);
            writer.WriteString("day", Day.ToString(DayFormat, CultureInfo.InvariantCulture));
            writer.WriteNumber("seq", Seq);
            writer.WriteString("mac", Mac);
            writer.WriteNumber("dayRecords", DayRecords);
            writer.WriteString("time", Time.UtcDateTime.ToString(TimeFormat, CultureInfo.InvariantCulture));
            writer.WriteString("reason", Reason);
            writer.WriteEndObject();
        }
        return buffer.WrittenSpan.ToArray();
    }
}
