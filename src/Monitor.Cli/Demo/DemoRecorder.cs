using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>
/// What the demo saw, shared between the bus consumers, the driver and the view (thread-safe): counts of quotes,
/// trades, fits and rejections, and every limit status change in arrival order. <see cref="StatusChanged"/> is
/// raised on the consumer's thread as each change arrives.
/// </summary>
internal sealed class DemoRecorder
{
    private readonly Lock _lock = new();
    private readonly List<ObservedStatusChange> _changes = [];
    private readonly List<CurveRejected> _rejections = [];
    private int _quotes;
    private int _trades;
    private int _fits;
    private int _outliers;
    private DateTimeOffset _lastActivity;

    public event Action<ObservedStatusChange>? StatusChanged;

    public event Action<CurveRejected>? CurveRejectedSeen;

    public int QuotesSent => Volatile.Read(ref _quotes);

    public int TradesSent => Volatile.Read(ref _trades);

    public int Fits => Volatile.Read(ref _fits);

    /// <summary>Quotes the accepted fits left out as outliers (the fat finger lands here).</summary>
    public int Outliers => Volatile.Read(ref _outliers);

    public void QuoteSent() => Interlocked.Increment(ref _quotes);

    public void TradeSent() => Interlocked.Increment(ref _trades);

    public void Fitted(CurveFitted message)
    {
        ArgumentNullException.ThrowIfNull(message);
        Interlocked.Increment(ref _fits);
        Interlocked.Add(ref _outliers, message.Fit.Excluded.Count(e => e.Reason.Contains("Outlier", StringComparison.OrdinalIgnoreCase)));
        Touch();
    }

    public void Rejected(CurveRejected message)
    {
        lock (_lock)
        {
            _rejections.Add(message);
            _lastActivity = DateTimeOffset.UtcNow;
        }
        CurveRejectedSeen?.Invoke(message);
    }

    public void Changed(LimitStatusChanged message)
    {
        var observed = ObservedStatusChange.From(message);
        lock (_lock)
        {
            _changes.Add(observed);
            _lastActivity = DateTimeOffset.UtcNow;
        }
        StatusChanged?.Invoke(observed);
    }

    public IReadOnlyList<ObservedStatusChange> Changes()
    {
        lock (_lock)
        {
            return _changes.ToArray();
        }
    }

    public IReadOnlyList<CurveRejected> Rejections()
    {
        lock (_lock)
        {
            return _rejections.ToArray();
        }
    }

    /// <summary>Real (wall-clock) time of the last event received from the service.</summary>
    public DateTimeOffset LastActivity
    {
        get
        {
            lock (_lock)
            {
                return _lastActivity;
            }
        }
    }

    private void Touch()
    {
        lock (_lock)
        {
            _lastActivity = DateTimeOffset.UtcNow;
        }
    }
}
