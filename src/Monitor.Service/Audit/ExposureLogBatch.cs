using System.Text.Json;

namespace Monitor.Service.Audit;

/// <summary>
/// The records of one change, appended together by <see cref="ExposureLogWriter.Append(ExposureLogBatch)"/> with one
/// fsync at the end. The batch remembers how many of its records are in the log, so after a failed write the same
/// batch is appended again and continues where it stopped: no record is written twice.
/// </summary>
public sealed class ExposureLogBatch
{
    private readonly List<(string Kind, DateTimeOffset EventTime, ExposureLogCause Cause, JsonElement Payload)> _entries = [];
    private readonly List<(long Seq, string Mac)> _records = [];

    public int Count => _entries.Count;

    /// <summary>Records of the batch already in the log (and chained).</summary>
    public int Written { get; internal set; }

    public bool IsComplete => Written == _entries.Count;

    /// <summary>The seq and mac of each record of the batch written so far, in batch order.</summary>
    public IReadOnlyList<(long Seq, string Mac)> Records => _records;

    internal void AddWritten(long seq, string mac) => _records.Add((seq, mac));

    /// <summary>Adds a record; the payload is serialised now, so a payload that cannot be JSON fails here, before any write.</summary>
    /// <exception cref="ArgumentException">The payload cannot be written as JSON (NaN, infinity, a cycle).</exception>
    public void Add(string kind, DateTimeOffset eventTime, ExposureLogCause cause, IReadOnlyDictionary<string, object?> payload)
    {
        ArgumentNullException.ThrowIfNull(cause);
        _entries.Add((kind, eventTime, cause, ExposureLogPayload.ToJson(payload, $"payload of a '{kind}' record")));
    }

    internal (string Kind, DateTimeOffset EventTime, ExposureLogCause Cause, JsonElement Payload) this[int index] => _entries[index];
}
