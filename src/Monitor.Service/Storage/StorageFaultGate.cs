using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Journal;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Storage;

/// <summary>
/// Runs the service's durable writes (exposure log appends, trade journal appends). A write that fails for a storage
/// reason (full disk, unwritable or missing folder: <see cref="IOException"/>, <see cref="UnauthorizedAccessException"/>)
/// is not the message's fault, so it must not end in an error queue: the gate marks the store unhealthy, logs once, and
/// retries the same write with backoff (<see cref="StorageOptions"/>: 1 s, 2 s, 4 s, then every 5 s) until it succeeds
/// or the caller cancels (shutdown). The caller holds the pipeline's lock meanwhile, so the pipeline stalls, consumers do
/// not complete and their messages stay unacknowledged in the broker. The writers must be retryable (a failed append
/// leaves no partial line and does not advance their sequence or hash chain), which they are.
/// </summary>
public sealed partial class StorageFaultGate
{
    public const string ExposureLog = "exposure-log";
    public const string TradeJournal = "trade-journal";

    private readonly Lock _sync = new();
    private readonly Dictionary<string, StorageFault> _faults = new(StringComparer.Ordinal);
    private TaskCompletionSource? _writable;
    private readonly StorageOptions _options;
    private readonly TimeProvider _time;
    private readonly ILogger<StorageFaultGate> _logger;
    private readonly MonitorMetrics? _metrics;

    public StorageFaultGate(IOptions<StorageOptions> options, TimeProvider time, ILogger<StorageFaultGate> logger, MonitorMetrics? metrics = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(time);
        ArgumentNullException.ThrowIfNull(logger);
        var errors = options.Value.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", errors), nameof(options));
        }
        _options = options.Value;
        _time = time;
        _logger = logger;
        _metrics = metrics;
    }

    /// <summary>True while any store has a failed write that has not since succeeded.</summary>
    public bool IsFailing
    {
        get { lock (_sync) { return _faults.Count > 0; } }
    }

    /// <summary>The stores failing now, by name.</summary>
    public IReadOnlyList<StorageFault> Faults
    {
        get { lock (_sync) { return _faults.Values.OrderBy(f => f.Store, StringComparer.Ordinal).ToList(); } }
    }

    /// <summary>
    /// Completes at once while no store is failing, else when the last failing store has written again. Work that writes
    /// nothing durable itself (a quote consumer) waits here, so that its message is not acknowledged during an outage.
    /// </summary>
    /// <exception cref="OperationCanceledException">Cancelled (carrying <paramref name="cancellationToken"/>).</exception>
    public Task WhenWritableAsync(CancellationToken cancellationToken)
    {
        Task waiter;
        lock (_sync)
        {
            if (_faults.Count == 0)
            {
                return Task.CompletedTask;
            }
            _writable ??= new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
            waiter = _writable.Task;
        }
        return waiter.WaitAsync(cancellationToken);
    }

    /// <summary>Runs <paramref name="write"/> until it succeeds; storage failures are retried, anything else is thrown at once.</summary>
    /// <param name="store">Which store the write goes to (health and logs are per store: the log and the journal may sit on different disks).</param>
    /// <param name="write">The durable write. It must be safe to run again after a storage failure.</param>
    /// <param name="cancellationToken">Stops the retries (shutdown): throws <see cref="OperationCanceledException"/> carrying this very token,
    /// which MassTransit treats as a cancelled delivery (the message goes back to its queue, not to the error queue).</param>
    public async Task RunAsync(string store, Func<CancellationToken, Task> write, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(store);
        ArgumentNullException.ThrowIfNull(write);
        var delay = _options.RetryFirstDelay;
        while (true)
        {
            cancellationToken.ThrowIfCancellationRequested();
            try
            {
                await write(cancellationToken).ConfigureAwait(false);
            }
            catch (Exception ex) when (IsStorageFailure(ex))
            {
                RecordFailure(store, ex);
                try
                {
                    await Task.Delay(delay, _time, cancellationToken).ConfigureAwait(false);
                }
                catch (OperationCanceledException)
                {
                    LogAbandoned(store);
                    throw;
                }
                delay = delay * 2 < _options.RetryMaxDelay ? delay * 2 : _options.RetryMaxDelay;
                continue;
            }
            RecordSuccess(store);
            return;
        }
    }

    /// <summary>As <see cref="RunAsync(string, Func{CancellationToken, Task}, CancellationToken)"/> for a synchronous write (an exposure log append).</summary>
    public Task RunAsync(string store, Action write, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(write);
        return RunAsync(store, _ =>
        {
            write();
            return Task.CompletedTask;
        }, cancellationToken);
    }

    /// <summary>A failure of the storage, not of the record: I/O and access errors, also when wrapped (Serilog's audit sinks wrap in AggregateException).</summary>
    public static bool IsStorageFailure(Exception ex) => ex switch
    {
        IOException or UnauthorizedAccessException => true,
        AggregateException aggregate => aggregate.InnerExceptions.Count > 0 && aggregate.InnerExceptions.All(IsStorageFailure),
        _ => false,
    };

    private void RecordFailure(string store, Exception ex)
    {
        var (path, reason) = Describe(ex);
        StorageFault fault;
        bool first;
        lock (_sync)
        {
            first = !_faults.TryGetValue(store, out var known);
            fault = first
                ? new StorageFault(store, path, reason, _time.GetUtcNow(), 1)
                : known! with { Path = path, Reason = reason, FailedAttempts = known.FailedAttempts + 1 };
            _faults[store] = fault;
        }
        _metrics?.StorageWriteFailures.Add(1, new KeyValuePair<string, object?>("store", store));
        if (first)
        {
            _metrics?.StoresFailing.Add(1);
            LogFailing(store, path, reason, _options.RetryMaxDelay.TotalSeconds);
        }
        else
        {
            LogStillFailing(store, fault.FailedAttempts, reason);
        }
    }

    private void RecordSuccess(string store)
    {
        StorageFault? ended;
        TaskCompletionSource? writable = null;
        lock (_sync)
        {
            if (!_faults.Remove(store, out ended))
            {
                return;
            }
            if (_faults.Count == 0)
            {
                (writable, _writable) = (_writable, null);
            }
        }
        writable?.TrySetResult();
        _metrics?.StoresFailing.Add(-1);
        LogRecovered(store, (_time.GetUtcNow() - ended.Since).TotalSeconds, ended.FailedAttempts);
    }

    private static (string Path, string Reason) Describe(Exception ex) => ex switch
    {
        ExposureLogWriteException log => (log.Path, log.Reason),
        JournalWriteException journal => (journal.Path, journal.Reason),
        AggregateException { InnerExceptions.Count: > 0 } aggregate => Describe(aggregate.InnerExceptions[0]),
        _ => ("unknown", $"{ex.GetType().Name}: {ex.Message}"),
    };

    [LoggerMessage(Level = LogLevel.Error, Message = "Storage {Store} failing: write to '{Path}' failed: {Reason}. The write is held and retried (at most {MaxDelaySeconds} s apart); messages stay unacknowledged until it succeeds")]
    private partial void LogFailing(string store, string path, string reason, double maxDelaySeconds);

    [LoggerMessage(Level = LogLevel.Debug, Message = "Storage {Store} still failing after {Attempts} attempts: {Reason}")]
    private partial void LogStillFailing(string store, int attempts, string reason);

    [LoggerMessage(Level = LogLevel.Information, Message = "Storage {Store} writable again after {OutageSeconds:0.0} s ({Attempts} failed attempts); the held write is done and work continues")]
    private partial void LogRecovered(string store, double outageSeconds, int attempts);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Storage {Store}: a held write was abandoned (shutdown) while the store still fails; nothing of it was written, and a message waiting on it is not acknowledged")]
    private partial void LogAbandoned(string store);
}
