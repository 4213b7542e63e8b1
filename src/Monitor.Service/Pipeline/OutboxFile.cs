using System.Globalization;
using System.Text;
using System.Text.Json;
using Monitor.Contracts.V1;

namespace Monitor.Service.Pipeline;

/// <summary>
/// The durable side of the <see cref="EventOutbox"/>, in the folder <c>&lt;ExposureLog:Folder&gt;-outbox</c>:
/// <list type="bullet">
/// <item><c>events.jsonl</c>: every event that has a log record, written right after its change's records, before it
/// is queued: <c>{"seq":N,"id":"&lt;guid&gt;","type":"&lt;wire type&gt;","message":{...}}</c>, one per line;</item>
/// <item><c>confirmed.txt</c>: the <c>seq</c> of each change's last event once the broker confirmed all its events, one
/// per line. Changes are published one after another, so the largest is a watermark: every event at or below it
/// was confirmed.</item>
/// </list>
/// At start <see cref="Unconfirmed"/> returns the events above the watermark (published again, with their ids: at least once)
/// and rewrites both files down to them. Events are flushed to the disk when the exposure log is
/// (<c>ExposureLog:FlushToDisk</c>); confirmations only to the operating system (a lost one means a duplicate, never a loss).
/// One writer per folder.
/// </summary>
public sealed class OutboxFile : IDisposable
{
    public const string EventsFile = "events.jsonl";
    public const string ConfirmedFile = "confirmed.txt";

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);
    private static readonly Dictionary<string, Type> WireTypes = new[] { typeof(LimitStatusChanged), typeof(CurveFitted), typeof(CurveRejected) }
        .ToDictionary(t => t.FullName!, StringComparer.Ordinal);

    private readonly string _folder;
    private readonly bool _flushToDisk;
    private readonly Lock _eventsSync = new();
    private readonly Lock _confirmSync = new();
    private FileStream? _events;
    private FileStream? _confirmed;
    private IReadOnlyList<OutboxEntry>? _waiting;

    public OutboxFile(string folder, bool flushToDisk)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(folder);
        _folder = folder;
        _flushToDisk = flushToDisk;
    }

    public string Folder => _folder;

    /// <summary>
    /// The events the broker never confirmed before this start, in order (read once, on first use of the file, before
    /// anything new is appended). Throws <see cref="InvalidDataException"/> naming the file and line when a complete
    /// line cannot be read; a torn last line (a crash mid-write) is dropped.
    /// </summary>
    public IReadOnlyList<OutboxEntry> Unconfirmed()
    {
        lock (_eventsSync)
        {
            return _waiting ??= Load();
        }
    }

    /// <summary>Reads the unconfirmed events and rewrites both files down to them.</summary>
    private List<OutboxEntry> Load()
    {
        Directory.CreateDirectory(_folder);
        var eventsPath = Path.Combine(_folder, EventsFile);
        var confirmedPath = Path.Combine(_folder, ConfirmedFile);
        var watermark = 0L;
        foreach (var (line, number) in CompleteLines(confirmedPath))
        {
            if (!long.TryParse(line, NumberStyles.None, CultureInfo.InvariantCulture, out var seq))
            {
                throw new InvalidDataException($"{confirmedPath}, line {number}: '{line}' is not a record seq.");
            }
            watermark = Math.Max(watermark, seq);
        }
        var waiting = new List<OutboxEntry>();
        var keep = new StringBuilder();
        foreach (var (line, number) in CompleteLines(eventsPath))
        {
            var entry = Parse(line, eventsPath, number);
            if (entry.Seq > watermark)
            {
                waiting.Add(entry);
                keep.Append(line).Append('\n');
            }
        }
        Replace(eventsPath, keep.ToString());
        Replace(confirmedPath, watermark > 0 ? watermark.ToString(CultureInfo.InvariantCulture) + "\n" : string.Empty);
        return waiting;
    }

    /// <summary>Appends one change's events (after its log records are written, before they are queued). I/O errors throw (the storage gate retries).</summary>
    public void Append(IReadOnlyList<OutboxEntry> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        if (entries.Count == 0)
        {
            return;
        }
        var text = new StringBuilder();
        foreach (var entry in entries)
        {
            text.Append(JsonSerializer.Serialize(new StoredEvent(entry.Seq, entry.Id, entry.Message.GetType().FullName!,
                JsonSerializer.SerializeToElement(entry.Message, entry.Message.GetType(), Json)), Json)).Append('\n');
        }
        var bytes = Encoding.UTF8.GetBytes(text.ToString());
        lock (_eventsSync)
        {
            _waiting ??= Load();
            _events ??= Open(EventsFile);
            var length = _events.Length;
            try
            {
                _events.Write(bytes);
                _events.Flush(flushToDisk: _flushToDisk);
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                // No partial line may stay: the retry writes the whole change again.
                _events.Dispose();
                _events = null;
                Storage.PartialWriteCutBack.CutBackTo(Path.Combine(_folder, EventsFile), length);
                throw;
            }
        }
    }

    /// <summary>Records that the broker confirmed every event up to <paramref name="seq"/>. Best effort: a failure is returned, not thrown.</summary>
    public string? Confirm(long seq)
    {
        lock (_confirmSync)
        {
            try
            {
                _confirmed ??= Open(ConfirmedFile);
                _confirmed.Write(Encoding.ASCII.GetBytes(seq.ToString(CultureInfo.InvariantCulture) + "\n"));
                _confirmed.Flush(flushToDisk: false);
                return null;
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                _confirmed?.Dispose();
                _confirmed = null;
                return $"{Path.Combine(_folder, ConfirmedFile)}: {ex.Message}";
            }
        }
    }

    public void Dispose()
    {
        lock (_eventsSync)
        {
            _events?.Dispose();
            _events = null;
        }
        lock (_confirmSync)
        {
            _confirmed?.Dispose();
            _confirmed = null;
        }
    }

    private FileStream Open(string name)
    {
        Directory.CreateDirectory(_folder);
        return new FileStream(Path.Combine(_folder, name), FileMode.Append, FileAccess.Write, FileShare.Read);
    }

    private static OutboxEntry Parse(string line, string path, int number)
    {
        try
        {
            var stored = JsonSerializer.Deserialize<StoredEvent>(line, Json) ?? throw new JsonException("null");
            if (!WireTypes.TryGetValue(stored.Type, out var type))
            {
                throw new JsonException($"type '{stored.Type}' is not an event the outbox keeps");
            }
            var message = stored.Message.Deserialize(type, Json) ?? throw new JsonException("message is null");
            return new OutboxEntry(stored.Seq, stored.Id, message);
        }
        catch (JsonException ex)
        {
            throw new InvalidDataException($"{path}, line {number}: {ex.Message}. Restore the file or remove the line (its event is then not sent again).", ex);
        }
    }

    /// <summary>The file's lines ended by LF (a torn last line is left out); none when it does not exist.</summary>
    private static IEnumerable<(string Line, int Number)> CompleteLines(string path)
    {
        if (!File.Exists(path))
        {
            yield break;
        }
        var text = File.ReadAllText(path, Encoding.UTF8);
        var end = text.LastIndexOf('\n');
        if (end < 0)
        {
            yield break;
        }
        var number = 0;
        foreach (var line in text[..end].Split('\n'))
        {
            number++;
            if (line.Length > 0)
            {
                yield return (line, number);
            }
        }
    }

    private static void Replace(string path, string content)
    {
        var temp = path + ".tmp";
        using (var stream = new FileStream(temp, FileMode.Create, FileAccess.Write, FileShare.None))
        {
            stream.Write(Encoding.UTF8.GetBytes(content));
            stream.Flush(flushToDisk: true);
        }
        File.Move(temp, path, overwrite: true);
    }

    private sealed record StoredEvent(long Seq, Guid Id, string Type, JsonElement Message);
}
