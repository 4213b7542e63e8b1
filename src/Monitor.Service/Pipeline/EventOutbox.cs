using System.Diagnostics;
using System.Threading.Channels;
using MassTransit;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Contracts.V1;
using Monitor.Service.Hosting;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Publishes the service's events outside the pipeline's lock, in the order the changes were made. The pipeline
/// writes a change to the exposure log, then hands its events here and moves on; one publisher drains the queue,
/// sending one change's events together and the next change's only after the broker confirmed them all.
/// A publish that fails (the broker is down) is retried with a growing pause until it succeeds, and the outbox
/// reports unhealthy meanwhile; the queue is bounded, so a long outage eventually holds the pipeline (and with it
/// the acknowledgements of inbound messages) instead of growing without end.
/// Book figures are conflated: within <see cref="MonitorOptions.BookEventInterval"/> only each book's newest figures
/// are kept, and they leave together as <see cref="BookExposuresBatch"/> messages of at most
/// <see cref="BookBatchSize"/> books, so a refit of the government curve does not send every book's figures tens of
/// times a second, nor a thousand messages where a few do. They go out on a lane of their own, so limit and curve
/// events (never conflated) do not queue behind them.
/// </summary>
public sealed partial class EventOutbox : BackgroundService
{
    /// <summary>Changes (not messages) the queue holds before the pipeline waits: minutes of a busy day's changes.</summary>
    public const int Capacity = 10_000;

    /// <summary>Books per <see cref="BookExposuresBatch"/>: a few hundred kilobytes of JSON at most.</summary>
    public const int BookBatchSize = 250;

    private static readonly TimeSpan FirstRetry = TimeSpan.FromMilliseconds(250);
    private static readonly TimeSpan LongestRetry = TimeSpan.FromSeconds(5);

    private readonly IBus _bus;
    private readonly OutboxFile? _durable;
    private bool _confirmFailing;
    private readonly MonitorMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger<EventOutbox> _logger;
    private readonly TimeSpan _bookInterval;
    private readonly Channel<QueuedChange> _queue = Channel.CreateBounded<QueuedChange>(
        new BoundedChannelOptions(Capacity) { SingleReader = true, FullMode = BoundedChannelFullMode.Wait });
    private readonly Lock _booksSync = new();
    private Dictionary<string, BookFigures> _pendingBooks = new(StringComparer.Ordinal);
    private long _backlog;
    private long _published;
    // Serialises the book lane's flushes (the timer's and WhenPublishedAsync's).
    private readonly SemaphoreSlim _bookLane = new(1, 1);
    private readonly Lock _healthSync = new();
    private string? _lastError;
    private DateTimeOffset? _failingSince;

    /// <summary>An outbox; <paramref name="durable"/> keeps the events with a log record until the broker confirms them (null: in memory only).</summary>
    public EventOutbox(IBus bus, IOptions<MonitorOptions> options, MonitorMetrics metrics, TimeProvider time, ILogger<EventOutbox> logger, OutboxFile? durable = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        _durable = durable;
        _bus = bus;
        _metrics = metrics;
        _time = time;
        _logger = logger;
        _bookInterval = options.Value.BookEventInterval;
    }

    /// <summary>Changes queued and not yet confirmed by the broker (book figures waiting for their interval not counted).</summary>
    public long Backlog => Interlocked.Read(ref _backlog);

    /// <summary>Messages the broker has confirmed since start.</summary>
    public long Published => Interlocked.Read(ref _published);

    /// <summary>The last publish failure while publishing is failing; null when the last publish went through.</summary>
    public string? LastError => Volatile.Read(ref _lastError);

    public bool IsHealthy => LastError is null;

    /// <summary>
    /// Queues one change's events (in order after every earlier change's) and its books' new figures. Waits only when
    /// the queue is full, which holds the caller's lock: back-pressure during a long broker outage.
    /// </summary>
    public ValueTask EnqueueAsync(IReadOnlyList<object> events, IReadOnlyList<BookFigures> books, CancellationToken cancellationToken) =>
        EnqueueAsync(events, books, cancellationToken, null, 0);

    private ValueTask EnqueueAsync(IReadOnlyList<object> events, IReadOnlyList<BookFigures> books, CancellationToken cancellationToken, Guid?[]? ids, long confirmSeq)
    {
        ArgumentNullException.ThrowIfNull(events);
        ArgumentNullException.ThrowIfNull(books);
        if (books.Count > 0 && _bookInterval > TimeSpan.Zero)
        {
            lock (_booksSync)
            {
                foreach (var book in books)
                {
                    _pendingBooks[book.Book] = book;
                }
            }
        }
        else if (books.Count > 0)
        {
            var recorded = events.Count;
            events = [.. events, .. Batches(books)];
            if (ids is not null)
            {
                ids = [.. ids, .. new Guid?[events.Count - recorded]];
            }
        }
        return events.Count == 0 ? ValueTask.CompletedTask : WriteAsync(new QueuedChange(events, Stopwatch.GetTimestamp(), ids, confirmSeq), cancellationToken);
    }

    /// <summary>
    /// Queues one change's events that have records in the exposure log, kept first in the <see cref="OutboxFile"/>
    /// (under the pipeline's storage gate: the caller passes the write) with their stable ids, and its books' figures.
    /// Once the broker has confirmed them all, the confirmation is recorded; at the next start any not confirmed are
    /// published again with the same ids.
    /// </summary>
    public async ValueTask EnqueueRecordedAsync(IReadOnlyList<OutboxEntry> events, IReadOnlyList<BookFigures> books, Func<Action, Task> keep, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(events);
        ArgumentNullException.ThrowIfNull(keep);
        if (_durable is { } durable && events.Count > 0)
        {
            await keep(() => durable.Append(events)).ConfigureAwait(false);
        }
        var messages = events.Select(e => e.Message).ToArray();
        if (events.Count > 0)
        {
            // The ids ride with the messages into the queue; books (no record, conflated) keep MassTransit's own ids.
            await EnqueueAsync(messages, books, cancellationToken, [.. events.Select(e => (Guid?)e.Id)], events[^1].Seq).ConfigureAwait(false);
        }
        else
        {
            await EnqueueAsync(messages, books, cancellationToken).ConfigureAwait(false);
        }
    }

    /// <summary>Completes when every change queued so far has been published (book figures waiting for their interval included).</summary>
    public async Task WhenPublishedAsync(CancellationToken cancellationToken)
    {
        await PublishPendingBooksAsync(cancellationToken).ConfigureAwait(false);
        while (Backlog > 0)
        {
            await Task.Delay(TimeSpan.FromMilliseconds(5), cancellationToken).ConfigureAwait(false);
        }
    }

    public override Task StartAsync(CancellationToken cancellationToken)
    {
        if (_durable is not null)
        {
            // Events of an earlier run whose records are in the log but which the broker never confirmed: first in line.
            var waiting = _durable.Unconfirmed();
            foreach (var entry in waiting)
            {
                Interlocked.Increment(ref _backlog);
                _queue.Writer.TryWrite(new QueuedChange([entry.Message], Stopwatch.GetTimestamp(), [entry.Id], entry.Seq));
            }
            if (waiting.Count > 0)
            {
                LogRepublishing(waiting.Count, waiting[0].Seq, waiting[^1].Seq);
            }
        }
        return base.StartAsync(cancellationToken);
    }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        // Stopped before the bus (registered after it): what is queued goes out while the broker connection is still up.
        try
        {
            await WhenPublishedAsync(cancellationToken).ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            LogUnpublishedAtStop(Backlog);
        }
        await base.StopAsync(cancellationToken).ConfigureAwait(false);
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var books = _bookInterval > TimeSpan.Zero ? FlushBooksPeriodicallyAsync(stoppingToken) : Task.CompletedTask;
        try
        {
            await foreach (var change in _queue.Reader.ReadAllAsync(stoppingToken).ConfigureAwait(false))
            {
                await PublishAsync(change.Events, change.Ids, stoppingToken).ConfigureAwait(false);
                if (change.ConfirmSeq > 0 && _durable is { } durable)
                {
                    RecordConfirmation(durable, change.ConfirmSeq);
                }
                Interlocked.Decrement(ref _backlog);
                _metrics.EventDelay.Record(Stopwatch.GetElapsedTime(change.QueuedAt).TotalMilliseconds);
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            // Stopping: StopAsync has already waited for the queue to drain as long as the host allowed.
        }
        await books.ConfigureAwait(false);
    }

    private void RecordConfirmation(OutboxFile durable, long seq)
    {
        var failure = durable.Confirm(seq);
        if (failure is not null && !_confirmFailing)
        {
            LogConfirmationNotRecorded(failure); // at worst the next start publishes these events again (same ids)
        }
        _confirmFailing = failure is not null;
    }

    private ValueTask WriteAsync(QueuedChange change, CancellationToken cancellationToken)
    {
        Interlocked.Increment(ref _backlog);
        if (_queue.Writer.TryWrite(change))
        {
            return ValueTask.CompletedTask;
        }
        return WaitToWriteAsync(change, cancellationToken);
    }

    private async ValueTask WaitToWriteAsync(QueuedChange change, CancellationToken cancellationToken)
    {
        LogQueueFull(Capacity);
        try
        {
            await _queue.Writer.WriteAsync(change, cancellationToken).ConfigureAwait(false);
        }
        catch
        {
            Interlocked.Decrement(ref _backlog);
            throw;
        }
    }

    private async Task FlushBooksPeriodicallyAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(_bookInterval, _time);
        try
        {
            while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
            {
                await PublishPendingBooksAsync(stoppingToken).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
    }

    private async Task PublishPendingBooksAsync(CancellationToken cancellationToken)
    {
        await _bookLane.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            Dictionary<string, BookFigures> due;
            lock (_booksSync)
            {
                if (_pendingBooks.Count == 0)
                {
                    return;
                }
                due = _pendingBooks;
                _pendingBooks = new Dictionary<string, BookFigures>(due.Count, StringComparer.Ordinal);
            }
            // One batch at a time: the next limit event waits behind at most one batch in the broker connection.
            foreach (var batch in Batches(due.Values))
            {
                await PublishAsync([batch], null, cancellationToken).ConfigureAwait(false);
            }
        }
        finally
        {
            _bookLane.Release();
        }
    }

    /// <summary>The books' figures in book id order, <see cref="BookBatchSize"/> to a message.</summary>
    private IEnumerable<BookExposuresBatch> Batches(IEnumerable<BookFigures> books)
    {
        var publishedAt = _time.GetUtcNow();
        return books.OrderBy(b => b.Book, StringComparer.Ordinal).Chunk(BookBatchSize)
            .Select(chunk => new BookExposuresBatch { Books = [.. chunk.Select(b => b.ToMessage())], PublishedAt = publishedAt });
    }

    /// <summary>Publishes one change's messages together, retrying those the broker did not confirm until all are through.</summary>
    private async Task PublishAsync(IReadOnlyList<object> messages, IReadOnlyList<Guid?>? ids, CancellationToken stoppingToken)
    {
        var waiting = messages;
        var waitingIds = ids;
        var pause = FirstRetry;
        while (true)
        {
            var sends = new Task[waiting.Count];
            for (var i = 0; i < waiting.Count; i++)
            {
                sends[i] = waitingIds?[i] is { } id
                    ? _bus.Publish(waiting[i], waiting[i].GetType(), Pipe.Execute<PublishContext>(c => c.MessageId = id), stoppingToken)
                    : _bus.Publish(waiting[i], waiting[i].GetType(), stoppingToken);
            }
            try
            {
                await Task.WhenAll(sends).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is not OperationCanceledException || !stoppingToken.IsCancellationRequested)
            {
                // Looked at per message below: some of the change's messages may have gone through.
            }
            var failed = new List<object>();
            var failedIds = new List<Guid?>();
            Exception? error = null;
            for (var i = 0; i < sends.Length; i++)
            {
                if (sends[i].IsCompletedSuccessfully)
                {
                    Interlocked.Increment(ref _published);
                }
                else
                {
                    failed.Add(waiting[i]);
                    failedIds.Add(waitingIds?[i]);
                    error ??= sends[i].Exception?.GetBaseException();
                }
            }
            if (failed.Count == 0)
            {
                MarkPublishing();
                return;
            }
            stoppingToken.ThrowIfCancellationRequested();
            MarkFailing(failed.Count, error?.Message ?? "publish cancelled");
            await Task.Delay(pause, _time, stoppingToken).ConfigureAwait(false);
            pause = TimeSpan.FromTicks(Math.Min(pause.Ticks * 2, LongestRetry.Ticks));
            waiting = failed;
            waitingIds = waitingIds is null ? null : failedIds;
        }
    }

    private void MarkFailing(int waiting, string reason)
    {
        lock (_healthSync)
        {
            if (_failingSince is null)
            {
                _failingSince = _time.GetUtcNow();
                LogPublishingFailed(waiting, reason);
            }
            Volatile.Write(ref _lastError, reason);
        }
    }

    private void MarkPublishing()
    {
        lock (_healthSync)
        {
            if (_failingSince is { } since)
            {
                LogPublishingRecovered(_time.GetUtcNow() - since);
                _failingSince = null;
                Volatile.Write(ref _lastError, null);
            }
        }
    }

    /// <summary>
    /// One change's events and when they were handed over (<see cref="Stopwatch.GetTimestamp"/>: durations are real time,
    /// whatever the clock); the stable ids of those with a log record, and the seq to record as confirmed (0: none).
    /// </summary>
    private readonly record struct QueuedChange(IReadOnlyList<object> Events, long QueuedAt, IReadOnlyList<Guid?>? Ids = null, long ConfirmSeq = 0);

    [LoggerMessage(Level = LogLevel.Error, Message = "Publishing events failed ({Count} waiting): {Reason}; retrying until the broker confirms them")]
    private partial void LogPublishingFailed(int count, string reason);

    [LoggerMessage(Level = LogLevel.Information, Message = "Publishing events recovered after {Outage}")]
    private partial void LogPublishingRecovered(TimeSpan outage);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Publishing {Count} event(s) of an earlier run again (records seq {First}..{Last}): the broker never confirmed them; consumers drop duplicates by MessageId")]
    private partial void LogRepublishing(int count, long first, long last);

    [LoggerMessage(Level = LogLevel.Warning, Message = "A broker confirmation could not be recorded ({Failure}); after a restart those events are published again")]
    private partial void LogConfirmationNotRecorded(string failure);

    [LoggerMessage(Level = LogLevel.Warning, Message = "The event queue is full ({Capacity} changes); the pipeline waits for the broker")]
    private partial void LogQueueFull(int capacity);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Stopping with {Count} change(s) not published; their records are in the exposure log")]
    private partial void LogUnpublishedAtStop(long count);
}
