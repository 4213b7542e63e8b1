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
    private readonly Dictionary<Guid, string> _tradeByMessageId = [];
    private readonly List<string> _leftOut = [];
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

    /// <summary>Records a trade before it is sent, so a status change it causes can name it.</summary>
    public void TradeSent(Guid messageId, string tradeId)
    {
        lock (_lock)
        {
            _tradeByMessageId[messageId] = tradeId;
        }
        Interlocked.Increment(ref _trades);
    }

    /// <summary>Quotes the accepted fits left out as outliers, newest last ("VGB-2041-05 at 12:00: outlier: residual ...").</summary>
    public IReadOnlyList<string> LeftOut()
    {
        lock (_lock)
        {
            return _leftOut.ToArray();
        }
    }

    private string? TradeOf(Guid messageId)
    {
        lock (_lock)
        {
            return _tradeByMessageId.GetValueOrDefault(messageId);
        }
    }

    public void Fitted(CurveFitted message)
    {
        ArgumentNullException.ThrowIfNull(message);
        Interlocked.Increment(ref _fits);
        var outliers = message.Fit.Excluded.Where(e => e.Reason.Contains("Outlier", StringComparison.OrdinalIgnoreCase)).ToArray();
        Interlocked.Add(ref _outliers, outliers.Length);
        if (outliers.Length > 0)
        {
            lock (_lock)
            {
                _leftOut.AddRange(outliers.Select(e => $"{e.QuoteId} at {DemoFormat.Clock(message.AsOf)} ({message.CurveId}): {e.Reason}"));
            }
        }
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
        var observed = ObservedStatusChange.From(message, TradeOf);
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
