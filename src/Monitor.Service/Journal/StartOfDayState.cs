using System.Globalization;
using System.Security.Cryptography;
using System.Text.Json;

namespace Monitor.Service.Journal;

/// <summary>
/// The business date the start-of-day positions file stands for, kept in <c>start-of-day.json</c> in the journal
/// folder with the file's SHA-256: <c>{"businessDate":"yyyy-MM-dd","positionsSha256":"&lt;hex&gt;"|null}</c>. A
/// restart replays every journal day from that date on (the file plus every later journal day), so one after
/// midnight or after a weekend, with the same file, loses no trade. A positions file whose bytes differ is a new
/// start-of-day state for today's business date: the days before it are taken as included in the file.
/// A missing state file starts a new one for today; an unreadable or malformed one stops the start.
/// </summary>
public sealed record StartOfDayState(DateOnly BusinessDate, string? PositionsSha256)
{
    public const string FileName = "start-of-day.json";

    /// <summary>Why the state is what it is (for the start-up log line).</summary>
    public string Reason { get; init; } = string.Empty;

    /// <summary>
    /// The state the restart replays from: the stored one when the positions file is unchanged, otherwise a new one for
    /// <paramref name="today"/> (written to the journal folder before anything is replayed).
    /// </summary>
    /// <exception cref="InvalidOperationException">The state file cannot be read or is malformed (names the file and the fix).</exception>
    public static StartOfDayState Resolve(string journalFolder, string? positionsFile, DateOnly today)
    {
        ArgumentNullException.ThrowIfNull(journalFolder);
        var path = Path.Combine(journalFolder, FileName);
        var hash = string.IsNullOrWhiteSpace(positionsFile) ? null : Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(positionsFile)));
        var stored = Read(path);
        if (stored is not null && stored.PositionsSha256 == hash)
        {
            return stored with
            {
                Reason = stored.BusinessDate == today
                    ? $"start-of-day state of {Day(today)}"
                    : $"positions file unchanged since the start-of-day state of {Day(stored.BusinessDate)}: journal days {Day(stored.BusinessDate)}..{Day(today)} replayed",
            };
        }
        var fresh = new StartOfDayState(today, hash)
        {
            Reason = stored is null
                ? $"no {FileName} in the journal folder: a new start-of-day state for {Day(today)}"
                : $"positions file changed since the start-of-day state of {Day(stored.BusinessDate)}: a new one for {Day(today)}; journal days before it are taken as included in the file",
        };
        Write(path, fresh);
        return fresh;
    }

    /// <summary>The stored business date the replay starts from; null when there is none. Throws like <see cref="Resolve"/> when unreadable.</summary>
    public static DateOnly? StoredDate(string journalFolder) => Read(Path.Combine(journalFolder, FileName))?.BusinessDate;

    private static StartOfDayState? Read(string path)
    {
        if (!File.Exists(path))
        {
            return null;
        }
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(path));
            var root = doc.RootElement;
            var date = DateOnly.ParseExact(root.GetProperty("businessDate").GetString() ?? string.Empty, "yyyy-MM-dd", CultureInfo.InvariantCulture);
            var hash = root.GetProperty("positionsSha256");
            return new StartOfDayState(date, hash.ValueKind == JsonValueKind.Null ? null : hash.GetString());
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or JsonException or KeyNotFoundException or InvalidOperationException or FormatException)
        {
            throw new InvalidOperationException(
                $"{path}: the start-of-day state cannot be read ({ex.Message}). It names the business date the positions file stands for; " +
                "restore it, or delete it to start a new business day from the start-of-day files (journal days before today are then not replayed).", ex);
        }
    }

    private static void Write(string path, StartOfDayState state)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        var temp = path + ".tmp";
        using (var stream = new FileStream(temp, FileMode.Create, FileAccess.Write, FileShare.None))
        using (var writer = new Utf8JsonWriter(stream))
        {
            writer.WriteStartObject();
            writer.WriteString("businessDate", Day(state.BusinessDate));
            if (state.PositionsSha256 is null)
            {
                writer.WriteNull("positionsSha256");
            }
            else
            {
                writer.WriteString("positionsSha256", state.PositionsSha256);
            }
            writer.WriteEndObject();
            writer.Flush();
            stream.Flush(flushToDisk: true);
        }
        File.Move(temp, path, overwrite: true); // whole or not at all
    }

    private static string Day(DateOnly day) => day.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
}
