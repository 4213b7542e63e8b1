using System.Text.Json;
using System.Text.RegularExpressions;
using Serilog;
using Serilog.Core;
using Serilog.Events;
using Monitor.Service.Engine;
using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// Appends records to the exposure log (format exposure-log/2, Audit/README.md): one file of JSON lines per
/// business day, each record MAC-chained (HMAC-SHA256 under the record key) to the one before, across days and restarts. Thread-safe;
/// one writer per folder (not enforced across processes). Writes go through a Serilog logger in
/// audit mode, so a failed write throws <see cref="ExposureLogWriteException"/> and the chain does
/// not advance: the same append can be retried once the folder is writable again.
/// </summary>
public sealed partial class ExposureLogWriter : IDisposable
{

    private readonly Lock _gate = new();
    private readonly ExposureLogOptions _options;
    private readonly RecordKey _key;
    private readonly TimeProvider _time;
    private readonly BusinessDayRoll _roll;
    private readonly DailyAuditFileSink _sink;
    private readonly DiskFlushControl _diskFlush = new();
    private readonly Logger _logger;
    private PendingRepair? _pendingRepair;
    private long _lastSeq;
    private string _lastMac = ExposureLogMac.Genesis;
    private DateOnly? _lastDay;
    private long _dayRecords;
    private bool _healthy = true;
    private ExposureLogWriteException? _lastError;
    private bool _disposed;

    /// <summary>Opens the log in <see cref="ExposureLogOptions.Folder"/> and continues its chain where it stopped. Day files are named by the business date of <paramref name="roll"/> (default midnight UTC).</summary>
    /// <exception cref="ArgumentException">Invalid options (the message names the key).</exception>
    /// <exception cref="ExposureLogOpenException">The end of the chain cannot be read or fails its MAC.</exception>
    public ExposureLogWriter(RecordKey key, ExposureLogOptions options, TimeProvider timeProvider, BusinessDayRoll? roll = null)
        : this(key, options, timeProvider, null, roll)
    {
    }

    /// <summary>As the public constructor, plus a test seam: a decorator of each day file's stream (to inject write failures).</summary>
    internal ExposureLogWriter(RecordKey key, ExposureLogOptions options, TimeProvider timeProvider, Func<Stream, Stream>? streamDecorator, BusinessDayRoll? roll = null)
    {
        ArgumentNullException.ThrowIfNull(key);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(timeProvider);
        var errors = options.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", errors), nameof(options));
        }

        _options = options;
        _key = key;
        _time = timeProvider;
        _roll = roll ?? BusinessDayRoll.UtcMidnight;
        ContinueChain();
        _sink = new DailyAuditFileSink(new ExposureLogFileHooks(options.FlushToDisk, streamDecorator, _diskFlush));
        _logger = new LoggerConfiguration().MinimumLevel.Verbose().AuditTo.Sink(_sink).CreateLogger();
    }

    /// <summary>False after a failed write, true again after the next successful one.</summary>
    public bool IsHealthy
    {
        get { lock (_gate) { return _healthy; } }
    }

    /// <summary>The last write failure (kept after recovery for diagnosis), null when none.</summary>
    public ExposureLogWriteException? LastError
    {
        get { lock (_gate) { return _lastError; } }
    }

    /// <summary>seq of the last record in the log (0 for an empty log).</summary>
    public long LastSeq
    {
        get { lock (_gate) { return _lastSeq; } }
    }

    /// <summary>mac of the last record in the log (64 zeros for an empty log).</summary>
    public string LastMac
    {
        get { lock (_gate) { return _lastMac; } }
    }

    /// <summary>
    /// The end of the chain as a checkpoint would anchor it (day, seq, mac, records in that day file), taken between two
    /// appends; null while the log is empty. A batch holds the writer for its whole length, so this never names a
    /// record whose batch is still being written.
    /// </summary>
    public (DateOnly Day, long Seq, string Mac, long DayRecords)? Anchor()
    {
        lock (_gate)
        {
            return _lastDay is { } day && _lastSeq > 0 ? (day, _lastSeq, _lastMac, _dayRecords) : null;
        }
    }

    /// <summary>Appends a record whose payload is a JSON object.</summary>
    /// <param name="kind">Record kind, <c>[a-z][a-z0-9-]*</c>, see <see cref="ExposureLogKinds"/>.</param>
    /// <param name="eventTime">Time of the event, from the causing message.</param>
    /// <param name="cause">The causing message.</param>
    /// <param name="payload">The figures, a JSON object (numbers as the caller wrote them).</param>
    /// <returns>The record as written, with its seq and hash.</returns>
    /// <exception cref="ArgumentException">Bad kind, cause or payload (nothing written).</exception>
    /// <exception cref="ExposureLogWriteException">The write failed; the chain did not advance.</exception>
    public ExposureLogRecord Append(string kind, DateTimeOffset eventTime, ExposureLogCause cause, JsonElement payload)
    {
        CheckKindAndCause(kind, cause);
        if (payload.ValueKind != JsonValueKind.Object)
        {
            throw new ArgumentException($"payload is a JSON {payload.ValueKind}: it must be a JSON object.", nameof(payload));
        }

        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_disposed, this);
            if (_pendingRepair is { } repair)
            {
                WriteRepairRecord(repair);
                _pendingRepair = null;
            }

            return Write(kind, eventTime, cause, payload);
        }
    }

    /// <summary>Appends a record whose payload is serialised from a dictionary by System.Text.Json.</summary>
    /// <exception cref="ArgumentException">A value cannot be written as JSON (NaN, infinity, a cycle).</exception>
    public ExposureLogRecord Append(string kind, DateTimeOffset eventTime, ExposureLogCause cause, IReadOnlyDictionary<string, object?> payload)
    {
        return Append(kind, eventTime, cause, ExposureLogPayload.ToJson(payload, "payload"));
    }

    /// <summary>
    /// Appends the records of <paramref name="batch"/> not yet in the log, in order, and puts them on the disk with one
    /// fsync at the end (when the log flushes to disk) instead of one per record.
    /// </summary>
    /// <exception cref="ArgumentException">A record's kind or cause is invalid (checked before anything is written).</exception>
    /// <exception cref="ExposureLogWriteException">
    /// A write failed: <see cref="ExposureLogBatch.Written"/> says how many records are in the log; append the same
    /// batch again once the folder is writable and it continues from there.
    /// </exception>
    public void Append(ExposureLogBatch batch)
    {
        ArgumentNullException.ThrowIfNull(batch);
        for (var i = batch.Written; i < batch.Count; i++)
        {
            var (kind, _, cause, _) = batch[i];
            CheckKindAndCause(kind, cause);
        }

        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_disposed, this);
            _diskFlush.Deferred = true;
            try
            {
                if (_pendingRepair is { } repair)
                {
                    WriteRepairRecord(repair);
                    _pendingRepair = null;
                }

                for (var i = batch.Written; i < batch.Count; i++)
                {
                    var (kind, eventTime, cause, payload) = batch[i];
                    var record = Write(kind, eventTime, cause, payload);
                    batch.AddWritten(record.Seq, record.Mac);
                    batch.Written = i + 1;
                }

                FlushBatchToDisk();
            }
            finally
            {
                _diskFlush.Deferred = false;
            }
        }
    }

    public void Dispose()
    {
        lock (_gate)
        {
            if (_disposed)
            {
                return;
            }

            _disposed = true;
            _logger.Dispose();
            _sink.Dispose();
        }
    }

    private static void CheckKindAndCause(string kind, ExposureLogCause cause)
    {
        ArgumentNullException.ThrowIfNull(cause);
        if (kind is null || !KindPattern().IsMatch(kind))
        {
            throw new ArgumentException($"kind '{kind}' must match [a-z][a-z0-9-]* and be at most 64 characters.", nameof(kind));
        }

        if (string.IsNullOrWhiteSpace(cause.MessageType))
        {
            throw new ArgumentException("cause.MessageType is empty: name the message type (or \"timer\").", nameof(cause));
        }
    }

    [GeneratedRegex("^[a-z][a-z0-9-]{0,63}$", RegexOptions.CultureInvariant)]
    private static partial Regex KindPattern();

    private void FlushBatchToDisk()
    {
        try
        {
            _diskFlush.FlushCurrent();
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // The records are written and chained; only their trip to the disk is in doubt. Report it like a failed write.
            _lastError = new ExposureLogWriteException(_options.Folder, $"putting the records on the disk failed: {ex.Message}", ex);
            _healthy = false;
            throw _lastError;
        }
    }

    private ExposureLogRecord Write(string kind, DateTimeOffset eventTime, ExposureLogCause cause, JsonElement payload)
    {
        var written = _time.GetUtcNow();
        var day = _roll.BusinessDateOf(written);
        if (_lastDay is { } lastDay && day < lastDay)
        {
            day = lastDay; // the clock stepped back: never write behind the newest file, or the chain would run backwards
        }

        var record = ExposureLogLine.Build(_key, _lastSeq + 1, kind, eventTime, written, cause, payload, _lastMac);
        var path = ExposureLogFiles.PathOf(_options.Folder, day);
        var logEvent = new LogEvent(
            written,
            LogEventLevel.Information,
            null,
            MessageTemplate.Empty,
            [
                new LogEventProperty(AuditLineFormatter.LineProperty, new ScalarValue(record.Line)),
                new LogEventProperty(DailyAuditFileSink.FileProperty, new ScalarValue(path)),
            ]);
        try
        {
            _logger.Write(logEvent);
        }
        catch (Exception ex)
        {
            var root = Innermost(ex);
            _lastError = new ExposureLogWriteException(path, $"{root.GetType().Name}: {root.Message}", ex);
            _healthy = false;
            throw _lastError;
        }

        _dayRecords = _lastDay == day ? _dayRecords + 1 : 1;
        _lastSeq = record.Seq;
        _lastMac = record.Mac;
        _lastDay = day;
        _healthy = true;
        return record;
    }

    private void WriteRepairRecord(PendingRepair repair)
    {
        try
        {
            PartialWriteCutBack.CutBackTo(repair.Path, repair.GoodLength);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            _lastError = new ExposureLogWriteException(repair.Path, "cutting off the torn last line failed: " + ex.Message, ex);
            _healthy = false;
            throw _lastError;
        }

        var payload = JsonSerializer.SerializeToElement(
            new Dictionary<string, object?>
            {
                ["file"] = Path.GetFileName(repair.Path),
                ["keptBytes"] = repair.GoodLength,
                ["removedBytes"] = repair.Fragment.Length,
                ["removedBase64"] = Convert.ToBase64String(repair.Fragment),
            },
            ExposureLogPayload.Json);
        Write(ExposureLogKinds.LogRepaired, _time.GetUtcNow(), new ExposureLogCause(null, "writer-start"), payload);
    }

    /// <summary>Finds the last record of the log and takes seq, hash and day from it.</summary>
    private void ContinueChain()
    {
        IReadOnlyList<(DateOnly Day, string Path)> files;
        try
        {
            files = ExposureLogFiles.List(_options.Folder);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new ExposureLogOpenException(_options.Folder, "the folder cannot be listed: " + ex.Message, ex);
        }

        var newerHasContent = false;
        for (var i = files.Count - 1; i >= 0; i--)
        {
            var (day, path) = files[i];
            ExposureLogTail tail;
            try
            {
                tail = ExposureLogTail.Read(path);
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                throw new ExposureLogOpenException(path, "the file cannot be read: " + ex.Message, ex);
            }

            if (tail.Fragment.Length > 0 && _pendingRepair is null && !newerHasContent)
            {
                // A crash mid-write: cut the torn line off and say so in the log (first thing on the first append).
                _pendingRepair = new PendingRepair(path, tail.CompleteLength, tail.Fragment);
            }
            else if (tail.Fragment.Length > 0)
            {
                throw new ExposureLogOpenException(path, $"the file ends in a torn line of {tail.Fragment.Length} bytes, but newer day files exist.");
            }

            newerHasContent |= tail.FileLength > 0;
            if (tail.LastLine is null)
            {
                continue; // empty (or only a torn line): the chain ended in an older file
            }

            var parsed = ExposureLogLine.Parse(_key, tail.LastLine);
            if (parsed.Record is null)
            {
                throw new ExposureLogOpenException(path, $"the last complete line (at byte {tail.CompleteLength - tail.LastLine.Length - 1}) is unparsable: {parsed.Error}");
            }

            if (!parsed.MacMatches)
            {
                throw new ExposureLogOpenException(path, $"the last complete line (seq {parsed.Record.Seq}) fails its MAC under the record key from {_key.Source}: stored {parsed.Record.Mac}, computed {parsed.ComputedMac}. Either the key is not the one the log was written with, or the line was changed after writing; run monitor verify-log with the key.");
            }

            _lastSeq = parsed.Record.Seq;
            _lastMac = parsed.Record.Mac;
            _lastDay = day;
            _dayRecords = _lastSeq - FirstSeqOf(path) + 1;
            return;
        }
    }

    /// <summary>seq of a day file's first record (its records run on by one, so the day's count is last - first + 1).</summary>
    private long FirstSeqOf(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite);
        using var reader = new StreamReader(stream);
        var line = reader.ReadLine();
        var parsed = line is null ? default : ExposureLogLine.Parse(_key, System.Text.Encoding.UTF8.GetBytes(line));
        return parsed.Record is { } record && parsed.MacMatches
            ? record.Seq
            : throw new ExposureLogOpenException(path, $"the first line is unparsable or fails its MAC under the record key from {_key.Source}; run monitor verify-log with the key.");
    }

    private static Exception Innermost(Exception ex)
    {
        while (ex is AggregateException { InnerException: { } inner })
        {
            ex = inner;
        }

        return ex;
    }

    private sealed record PendingRepair(string Path, long GoodLength, byte[] Fragment);
}
