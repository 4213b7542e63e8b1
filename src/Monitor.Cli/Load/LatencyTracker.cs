using System.Collections.Concurrent;
using System.Diagnostics;

namespace Monitor.Cli.Load;

/// <summary>
/// Matches outbound events to the quotes that caused them (the event's CauseMessageId is the quote's MessageId) and
/// records publish -> receipt latencies, both on this process's <see cref="Stopwatch"/>. Only quotes registered as
/// measured (after the warm-up) count. Kinds: the first CurveFitted, LimitStatusChanged and book entry (BookExposuresBatch) per
/// cause quote, the last book entry per cause (all books revalued), and "any quote -> curve": every quote
/// published up to a fit's cause quote is reflected in that fit (the service takes the latest quote of the conflation
/// window as the cause), so its latency is the fit's receipt minus its own publish time, conflation wait included.
/// </summary>
internal sealed class LatencyTracker
{
    private readonly ConcurrentDictionary<Guid, Sent> _sent = new();
    private readonly ConcurrentDictionary<Guid, byte> _curveSeen = new();
    private readonly ConcurrentDictionary<Guid, byte> _statusSeen = new();
    private readonly ConcurrentDictionary<Guid, long> _booksLast = new();
    private readonly long[] _published;
    private readonly Lock _coverLock = new();
    private long _covered = -1;
    private long _statusEvents;
    private long _bookEvents;
    private long _curveEvents;

    private readonly long _firstMeasured;

    /// <summary>Room for <paramref name="capacity"/> quotes; those numbered below <paramref name="firstMeasured"/> are the warm-up and not recorded.</summary>
    public LatencyTracker(long capacity, long firstMeasured)
    {
        _published = new long[capacity];
        _firstMeasured = firstMeasured;
    }

    public LatencyRecorder Curve { get; } = new("quote -> CurveFitted (cause quote)");

    public LatencyRecorder AnyQuoteCurve { get; } = new("quote -> CurveFitted (every quote)");

    public LatencyRecorder Status { get; } = new("quote -> LimitStatusChanged");

    public LatencyRecorder BooksFirst { get; } = new("quote -> first book figures");

    public LatencyRecorder BooksLast { get; } = new("quote -> last book figures");

    public LatencyRecorder Consumed { get; } = new("quote -> consumed");

    public long StatusEvents => Interlocked.Read(ref _statusEvents);

    public long BookEvents => Interlocked.Read(ref _bookEvents);

    public long CurveEvents => Interlocked.Read(ref _curveEvents);

    /// <summary>Notes that quote number <paramref name="sequence"/> with message id <paramref name="id"/> is published at <paramref name="timestamp"/> (<see cref="Stopwatch.GetTimestamp"/>).</summary>
    public void Published(Guid id, long sequence, long timestamp)
    {
        _published[sequence] = timestamp;
        _sent[id] = new Sent(sequence, timestamp, sequence >= _firstMeasured);
    }

    public void OnConsumed(Guid id, long timestamp)
    {
        if (_sent.TryGetValue(id, out var sent) && sent.Measured)
        {
            Consumed.Record(Stopwatch.GetElapsedTime(sent.Timestamp, timestamp));
        }
    }

    public void OnCurveFitted(Guid? cause, long timestamp)
    {
        Interlocked.Increment(ref _curveEvents);
        if (cause is not { } id || !_sent.TryGetValue(id, out var sent))
        {
            return;
        }
        if (_curveSeen.TryAdd(id, 0) && sent.Measured)
        {
            Curve.Record(Stopwatch.GetElapsedTime(sent.Timestamp, timestamp));
        }
        lock (_coverLock)
        {
            for (var s = _covered + 1; s <= sent.Sequence; s++)
            {
                if (s >= _firstMeasured && _published[s] != 0)
                {
                    AnyQuoteCurve.Record(Stopwatch.GetElapsedTime(_published[s], timestamp));
                }
            }
            _covered = Math.Max(_covered, sent.Sequence);
        }
    }

    public void OnStatusChanged(Guid? cause, long timestamp)
    {
        Interlocked.Increment(ref _statusEvents);
        if (cause is { } id && _sent.TryGetValue(id, out var sent) && sent.Measured && _statusSeen.TryAdd(id, 0))
        {
            Status.Record(Stopwatch.GetElapsedTime(sent.Timestamp, timestamp));
        }
    }

    public void OnBookUpdated(Guid? cause, long timestamp)
    {
        Interlocked.Increment(ref _bookEvents);
        if (cause is { } id && _sent.TryGetValue(id, out var sent) && sent.Measured)
        {
            if (_booksLast.TryAdd(id, timestamp))
            {
                BooksFirst.Record(Stopwatch.GetElapsedTime(sent.Timestamp, timestamp));
            }
            else
            {
                _booksLast[id] = timestamp;
            }
        }
    }

    /// <summary>Records the last book update seen per cause quote; call once, after the events have drained.</summary>
    public void Finish()
    {
        foreach (var (id, last) in _booksLast)
        {
            BooksLast.Record(Stopwatch.GetElapsedTime(_sent[id].Timestamp, last));
        }
    }

    private readonly record struct Sent(long Sequence, long Timestamp, bool Measured);
}
