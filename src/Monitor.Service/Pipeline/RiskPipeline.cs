using System.Diagnostics;
using System.Globalization;
using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Contracts.V1;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Messaging;
using Monitor.Service.Storage;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Serialises every change to the <see cref="RiskEngine"/> (one at a time, under an async lock), writes what
/// changed to the exposure log first, then hands its events to the <see cref="EventOutbox"/>, which publishes them
/// in order outside the lock. Quotes do not take the lock: the consumer checks and prices a quote, journals it and
/// leaves it in the <see cref="QuoteInbox"/>; the refit loop (<see cref="CurveRefitWorker"/>) takes every waiting
/// quote into the engine and refits once on the latest of each. Every journal and exposure log write goes through the
/// <see cref="StorageFaultGate"/>: on a full disk or an unwritable folder the write is held and retried under the lock,
/// so the pipeline stalls, consumers do not return and their messages stay unacknowledged (never in an error queue)
/// until the write succeeds; then everything continues where it stopped.
/// </summary>
public sealed partial class RiskPipeline
{
    private readonly RiskEngine _engine;
    private readonly ExposureLogWriter _log;
    private readonly TradeJournal _journal;
    private readonly StorageFaultGate _storage;
    private readonly QuoteInbox _inbox;
    private readonly EventOutbox _outbox;
    private readonly MonitorMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger<RiskPipeline> _logger;
    // Never disposed: the stop record is written while the host stops, whatever order the container disposes in
    // (a SemaphoreSlim whose wait handle is never read holds no unmanaged resource).
    private readonly SemaphoreSlim _gate = new(1, 1);
    private readonly Channel<bool> _refitSignal = Channel.CreateBounded<bool>(new BoundedChannelOptions(1) { FullMode = BoundedChannelFullMode.DropWrite });
    private readonly Dictionary<string, Cause> _pendingCause = new(StringComparer.Ordinal);

    public RiskPipeline(RiskEngine engine, ExposureLogWriter log, TradeJournal journal, StorageFaultGate storage, QuoteInbox inbox, EventOutbox outbox, MonitorMetrics metrics, TimeProvider time, ILogger<RiskPipeline> logger)
    {
        _engine = engine;
        _log = log;
        _journal = journal;
        _storage = storage;
        _inbox = inbox;
        _outbox = outbox;
        _metrics = metrics;
        _time = time;
        _logger = logger;
    }

    /// <summary>Completes a read when quotes wait for a refit.</summary>
    public ChannelReader<bool> RefitRequests => _refitSignal.Reader;

    /// <summary>Runs <paramref name="read"/> on the engine under the lock (for views and snapshots).</summary>
    public async Task<T> ReadAsync<T>(Func<RiskEngine, T> read, CancellationToken cancellationToken = default)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            return read(_engine);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Defines or redefines an instrument. A refusal throws before anything changes; an accepted definition that changes
    /// anything is journalled (fsynced) and logged (<c>instrument-defined</c>, the old and the new definition) before
    /// the engine takes it, so a restart replays it in order with the trades. One equal in every member changes nothing.
    /// </summary>
    public async Task DefineInstrumentAsync(Bond bond, Cause cause, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(bond);
        ArgumentNullException.ThrowIfNull(cause);
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var previous = _engine.CheckDefinition(bond);
            if (previous is not null && BondTerms.Same(previous, bond))
            {
                return;
            }
            await _storage.RunAsync(StorageFaultGate.TradeJournal, _ => _journal.AppendDefinitionAsync(bond, CancellationToken.None).AsTask(), cancellationToken).ConfigureAwait(false);
            var payload = new Dictionary<string, object?>
            {
                ["instrumentId"] = bond.Id,
                ["previous"] = previous is null ? null : new Dictionary<string, object?>(BondTerms.ToDictionary(previous)),
                ["definition"] = new Dictionary<string, object?>(BondTerms.ToDictionary(bond)),
            };
            await _storage.RunAsync(StorageFaultGate.ExposureLog, () => _log.Append(ExposureLogKinds.InstrumentDefined, cause.EventTime, LogCause(cause), payload), cancellationToken).ConfigureAwait(false);
            _engine.DefineInstrument(bond);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Checks and prices a quote, journals it and leaves it for the next refit, without waiting for the engine's lock
    /// (a refit in progress does not hold quote consumers up). Bad input throws before anything is kept. While storage
    /// fails the quote waits here unacknowledged, like the trades behind the stalled lock, rather than pile up in memory.
    /// </summary>
    public async Task AcceptQuoteAsync(BondQuote quote, Cause cause, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(cause);
        cancellationToken.ThrowIfCancellationRequested();
        var priced = _engine.PriceQuote(quote, _time.GetUtcNow());
        if (!_journal.IsHealthy)
        {
            // Quotes of a failed batch wait in the journal: retry them through the gate until they are on the disk.
            await _storage.RunAsync(StorageFaultGate.TradeJournal, _journal.FlushAsync, cancellationToken).ConfigureAwait(false);
        }
        await _storage.WhenWritableAsync(cancellationToken).ConfigureAwait(false);
        _journal.AppendQuote(quote); // kept to refit the curves after a restart; not awaited: quotes refresh all day
        _inbox.Add(priced, cause);
        _refitSignal.Writer.TryWrite(true);
    }

    /// <summary>Curves marked for a refit plus quotes not yet taken into the engine (tests wait for none).</summary>
    public Task<int> WaitingRefitsAsync(CancellationToken cancellationToken = default) =>
        ReadAsync(e => e.DirtyCurves().Count + _inbox.Count, cancellationToken);

    /// <summary>Completes when every event of the changes made so far has been published.</summary>
    public Task WhenPublishedAsync(CancellationToken cancellationToken = default) => _outbox.WhenPublishedAsync(cancellationToken);

    /// <summary>Refits every curve with waiting quotes, revalues the affected books, logs and publishes the outcome.</summary>
    public async Task RefitAsync(CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            _inbox.Drain(TakeQuote);
            var dirty = _engine.DirtyCurves();
            if (dirty.Count == 0)
            {
                return;
            }
            var cause = dirty.Select(k => _pendingCause.GetValueOrDefault(k)).OfType<Cause>().MaxBy(c => c.EventTime)
                ?? Cause.Internal("refit", now);
            var started = Stopwatch.GetTimestamp();
            var result = _engine.RefitDirtyCurves(now);
            _metrics.FitDuration.Record(Stopwatch.GetElapsedTime(started).TotalMilliseconds - result.ExposureMilliseconds);
            result.StatusChanges.AddRange(_engine.ExpireLimits(now)); // a temporary limit past its expiry ends before the refit's figures are published
            foreach (var key in dirty)
            {
                _pendingCause.Remove(key);
            }
            await CommitAsync(result, cause, now, cancellationToken).ConfigureAwait(false);
            _metrics.RefitDuration.Record(Stopwatch.GetElapsedTime(started).TotalMilliseconds);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Hands a waiting quote to the engine (under the lock). A quote its bond's new terms make unusable is dropped.</summary>
    private void TakeQuote(PricedQuote quote, Cause cause)
    {
        try
        {
            _pendingCause[_engine.StoreQuote(quote)] = cause;
        }
        catch (MessageRejectedException ex)
        {
            LogQuoteDropped(quote.Quote.InstrumentId, ex.Message);
        }
    }

    /// <summary>Fits the government curve from par yields (through the quality gate), revalues the books, logs and publishes.</summary>
    public async Task ApplyParYieldsAsync(string curveId, DateTimeOffset asOf, IReadOnlyList<(string Tenor, double ParYield)> points, Cause cause, CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            var started = Stopwatch.GetTimestamp();
            var result = _engine.ApplyParYields(curveId, asOf, points, now);
            _metrics.FitDuration.Record(Stopwatch.GetElapsedTime(started).TotalMilliseconds - result.ExposureMilliseconds);
            await CommitAsync(result, cause, now, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    public async Task<TradeOutcome> ApplyTradeAsync(TradeInput trade, Cause cause, CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            // The trade is written to the exposure log before the books change: a failed write throws with the state
            // untouched, the message is retried, and the retry applies it (rather than finding a duplicate).
            var outcome = _engine.CheckTrade(trade);
            if (outcome == TradeOutcome.Applied)
            {
                // Durable before anything changes and before the consumer returns, so the broker's ack follows the
                // fsync. Each write is held through a storage outage and retried alone (the journal's is not repeated
                // for the log's). A shutdown during the outage leaves the message unacknowledged: a trade journalled
                // but not logged is logged by the start-up replay, and its redelivery is then a duplicate.
                await _storage.RunAsync(StorageFaultGate.TradeJournal, _ => _journal.AppendTradeAsync(trade, CancellationToken.None).AsTask(), cancellationToken).ConfigureAwait(false);
                await _storage.RunAsync(StorageFaultGate.ExposureLog, () => _log.Append(ExposureLogKinds.TradeApplied, cause.EventTime, LogCause(cause), TradePayload(trade)), cancellationToken).ConfigureAwait(false);
            }
            else
            {
                LogTradeIgnored(trade.TradeId, trade.Version, outcome.ToString());
            }
            var result = _engine.ApplyTrade(trade, now);
            await CommitAsync(result, cause, now, cancellationToken).ConfigureAwait(false);
            return result.Trade!.Value;
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Puts a new limits file in force, logs the change (the file's SHA-256, and the old and new definition of every limit
    /// added, removed or modified) and publishes the status changes it causes: removed limits end as "retired". A reload
    /// that removes every limit or a limit at warning or breach is flagged in its record and raises
    /// <see cref="LimitsReloadFlagged"/>.
    /// </summary>
    public async Task<Limits.LimitReloadResult> ReloadLimitsAsync(Limits.LimitsConfiguration limits, string source, string sha256, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(limits);
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            var reload = _engine.ReloadLimits(limits, now);
            var cause = Cause.Internal("limits-file", now);
            var flags = reload.Flags;
            var payload = new Dictionary<string, object?>
            {
                ["source"] = source,
                ["sha256"] = sha256,
                ["added"] = reload.Added.Select(LimitRecord.Of).ToArray(),
                ["removed"] = reload.Removed.Select(LimitRecord.Of).ToArray(),
                ["modified"] = reload.Modified.Select(LimitRecord.Of).ToArray(),
                ["limits"] = limits.Limits.Count,
                ["flagged"] = flags.ToArray(),
            };
            await _storage.RunAsync(StorageFaultGate.ExposureLog, () => _log.Append(ExposureLogKinds.LimitsReloaded, now, LogCause(cause), payload), cancellationToken).ConfigureAwait(false);
            var result = new EngineResult { CurvesUsed = _engine.CurvesInUse() };
            result.StatusChanges.AddRange(reload.StatusChanges);
            object? alert = flags.Count == 0 ? null : new LimitsReloadFlagged
            {
                Source = source,
                Sha256 = sha256,
                Reasons = flags,
                RemovedLimitIds = reload.Removed.Select(l => l.Id).ToArray(),
                LimitCount = reload.LimitCount,
                ProcessedAt = now,
            };
            await CommitAsync(result, cause, now, cancellationToken, alert).ConfigureAwait(false);
            return reload;
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Ends the temporary limits the business clock has passed the expiry of (a change to "expired" each, with its record
    /// and event). Called on a timer by <see cref="LimitExpiryWorker"/> and at each refit.
    /// </summary>
    public async Task<int> ExpireLimitsAsync(CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            var result = new EngineResult { CurvesUsed = _engine.CurvesInUse() };
            result.StatusChanges.AddRange(_engine.ExpireLimits(now));
            if (result.StatusChanges.Count > 0)
            {
                await CommitAsync(result, Cause.Internal("limit-expiry", now), now, cancellationToken).ConfigureAwait(false);
            }
            return result.StatusChanges.Count;
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Writes a snapshot of every valued book to the exposure log (the periodic <c>snapshot</c>).</summary>
    public async Task SnapshotAsync(string kind, CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            var batch = new ExposureLogBatch();
            AddBookSnapshots(batch, kind, now, null);
            await WriteLogAsync(batch, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Closes business day <paramref name="day"/>: each valued book's <c>close-snapshot</c>, then one <c>day-closed</c>
    /// record, in one write. Returns the close with that record's seq and mac (for <see cref="IDayCloseListener"/>s).
    /// </summary>
    public async Task<DayClose> CloseDayAsync(DateOnly day, DateTimeOffset rollAt, CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            var batch = new ExposureLogBatch();
            var books = AddBookSnapshots(batch, ExposureLogKinds.CloseSnapshot, now, day);
            batch.Add(ExposureLogKinds.DayClosed, rollAt, new ExposureLogCause(null, "day-roll"), new Dictionary<string, object?>
            {
                ["businessDate"] = Day(day),
                ["rollAt"] = rollAt.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture),
                ["books"] = books,
            });
            await WriteLogAsync(batch, cancellationToken).ConfigureAwait(false);
            return new DayClose(day, rollAt, _log.LastSeq, _log.LastMac, books);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Records a stop (at any time of day; not a close): each valued book's <c>stop-snapshot</c>, then one
    /// <c>service-stopped</c> record. Skipped (logged) while storage fails: the lock is held by a stalled write.
    /// </summary>
    public async Task RecordStopAsync(DateOnly day, CancellationToken cancellationToken)
    {
        if (_storage.IsFailing)
        {
            LogStopSkipped(string.Join("; ", _storage.Faults));
            return;
        }
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            var batch = new ExposureLogBatch();
            var books = AddBookSnapshots(batch, ExposureLogKinds.StopSnapshot, now, day);
            batch.Add(ExposureLogKinds.ServiceStopped, now, new ExposureLogCause(null, "service-stop"), new Dictionary<string, object?>
            {
                ["businessDate"] = Day(day),
                ["books"] = books,
            });
            await WriteLogAsync(batch, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Adds a record of <paramref name="kind"/> per valued book (book order); returns how many.</summary>
    private int AddBookSnapshots(ExposureLogBatch batch, string kind, DateTimeOffset now, DateOnly? day)
    {
        var curves = _engine.CurvesInUse();
        var count = 0;
        foreach (var book in _engine.Books.Values.Where(b => b.Exposures is not null).OrderBy(b => b.Id, StringComparer.Ordinal))
        {
            var payload = BookPayload(book.Id, book.Exposures!.Totals, curves);
            if (day is { } d)
            {
                payload["businessDate"] = Day(d);
            }
            AddProvisional(payload, book.ProvisionalReasons);
            batch.Add(kind, now, new ExposureLogCause(null, "timer"), payload);
            count++;
        }
        return count;
    }

    private static string Day(DateOnly day) => day.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    private async Task CommitAsync(EngineResult result, Cause cause, DateTimeOffset now, CancellationToken cancellationToken, object? alert = null)
    {
        var logCause = LogCause(cause);
        var batch = new ExposureLogBatch();
        var curves = EventMapper.CurveVersions(_engine);
        var messages = new List<object>();
        foreach (var outcome in result.Curves)
        {
            var report = outcome.Result?.Report;
            var payload = new Dictionary<string, object?>
            {
                ["curve"] = CurveKeyLabel.Of(outcome.CurveKey),
                ["version"] = outcome.Version,
                ["model"] = report?.Model.ToString(),
                ["parameters"] = outcome.Result?.Parameters,
                ["rmseBp"] = report?.RmseBp,
                ["maxErrorBp"] = report?.MaxAbsErrorBp,
                ["iterations"] = report?.Iterations,
                ["used"] = report?.UsedIds.Count ?? 0,
                ["excluded"] = report?.Exclusions.Select(e => $"{e.Id}: {e.Reason}").ToArray() ?? [],
            };
            if (outcome.Accepted)
            {
                batch.Add(ExposureLogKinds.CurveFitted, cause.EventTime, logCause, payload);
                messages.Add(EventMapper.CurveFitted(outcome, CurveKeyLabel.Of(outcome.CurveKey) == CurveKeyLabel.Government || CurveKeyLabel.IsReference(outcome.CurveKey) ? null : CurveKeyLabel.Government, cause, now));
            }
            else
            {
                payload["reasons"] = outcome.Verdict.Reasons.ToArray();
                batch.Add(ExposureLogKinds.CurveRejected, cause.EventTime, logCause, payload);
                messages.Add(EventMapper.CurveRejected(outcome, cause, now));
                LogCurveRejected(CurveKeyLabel.Of(outcome.CurveKey), string.Join("; ", outcome.Verdict.Reasons));
            }
        }
        foreach (var change in result.StatusChanges)
        {
            var payload = new Dictionary<string, object?>
            {
                ["limitId"] = change.LimitId,
                ["scope"] = change.Scope.ToString(),
                ["measure"] = Limits.LimitsFileParser.JsonName(change.Measure),
                ["status"] = EventMapper.StatusName(change.Current),
                ["previous"] = EventMapper.StatusName(change.Previous),
                ["exposure"] = change.Exposure,
                ["limit"] = change.LimitValue,
                ["utilisation"] = change.Utilisation,
                ["curves"] = result.CurvesUsed,
            };
            var provisional = _engine.ProvisionalReasons(change.Scope);
            AddProvisional(payload, provisional);
            batch.Add(ExposureLogKinds.StatusChange, cause.EventTime, logCause, payload);
            messages.Add(EventMapper.StatusChanged(change, curves, cause, now, provisional));
            _metrics.StatusChanges.Add(1);
            // Also a line of the service log, in the event's words; a breach at Warning, other changes at Information.
            LogLimitStatus(change.Current == Limits.LimitStatus.Breach ? LogLevel.Warning : LogLevel.Information, change.LimitId,
                change.Scope.Level.ToString().ToLowerInvariant(), change.Scope.Id, Limits.LimitsFileParser.JsonName(change.Measure),
                EventMapper.StatusName(change.Current), EventMapper.StatusName(change.Previous), change.Exposure, change.LimitValue);
        }
        // One fsync for the change's records, all on the disk before any of its events can be published.
        await WriteLogAsync(batch, cancellationToken).ConfigureAwait(false);
        var books = new List<BookFigures>(result.Books.Count);
        foreach (var update in result.Books)
        {
            books.Add(new BookFigures(update, curves, cause, now));
        }
        if (result.Books.Count > 0)
        {
            _metrics.ExposureDuration.Record(result.ExposureMilliseconds);
        }
        _metrics.QueueLag.Record((now - cause.EventTime).TotalMilliseconds);
        // Published by the outbox, in order, outside this lock: 1,000 book events awaited here held every quote and
        // trade behind the broker's round trips (measured with `monitor load`). Each event has one record of the batch,
        // in the same order: its seq and mac give the event's stable id, and the outbox keeps it until confirmed.
        var recorded = new OutboxEntry[messages.Count];
        for (var i = 0; i < messages.Count; i++)
        {
            var (seq, mac) = batch.Records[i];
            recorded[i] = new OutboxEntry(seq, OutboxEntry.IdOf(seq, mac), messages[i]);
        }
        if (alert is not null)
        {
            // The reload's alert has its record apart (limits-reloaded, written before): published first, kept in memory only.
            await _outbox.EnqueueAsync([alert], [], cancellationToken).ConfigureAwait(false);
        }
        await _outbox.EnqueueRecordedAsync(recorded, books, keep => _storage.RunAsync(StorageFaultGate.ExposureLog, keep, cancellationToken), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>
    /// Appends a change's records to the exposure log (one fsync), held through a storage outage by the
    /// <see cref="StorageFaultGate"/>: a failed write keeps the batch's progress, so each retry continues where it stopped.
    /// </summary>
    private async Task WriteLogAsync(ExposureLogBatch batch, CancellationToken cancellationToken)
    {
        if (batch.Count > 0)
        {
            var started = Stopwatch.GetTimestamp();
            await _storage.RunAsync(StorageFaultGate.ExposureLog, () => _log.Append(batch), cancellationToken).ConfigureAwait(false);
            _metrics.LogWriteDuration.Record(Stopwatch.GetElapsedTime(started).TotalMilliseconds);
        }
    }

    /// <summary>Marks a record built on provisional figures (members absent otherwise, so final records keep their shape).</summary>
    private static void AddProvisional(Dictionary<string, object?> payload, IReadOnlyList<string> reasons)
    {
        if (reasons.Count > 0)
        {
            payload["provisional"] = true;
            payload["provisionalReasons"] = reasons.ToArray();
        }
    }

    private static Dictionary<string, object?> BookPayload(string book, IReadOnlyDictionary<Limits.ExposureMeasure, double> totals, string curves)
    {
        var payload = new Dictionary<string, object?> { ["book"] = book, ["curves"] = curves };
        foreach (var (measure, value) in totals)
        {
            payload[Limits.LimitsFileParser.JsonName(measure)] = value;
        }
        return payload;
    }

    /// <summary>
    /// Logs and publishes what the start-up replay of the journal changed (its refit: curves, books, limit statuses),
    /// with cause <c>journal-replay</c>, so every status the restarted service holds has its record and its event.
    /// </summary>
    public async Task CommitRecoveryAsync(EngineResult replayRefit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(replayRefit);
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = _time.GetUtcNow();
            await CommitAsync(replayRefit, Cause.Internal("journal-replay", now), now, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>
    /// Writes the <c>trade-applied</c> records that a crash between the journal's fsync and the log write left out,
    /// for trades the start-up replay applied from the journal. Returns how many were written.
    /// </summary>
    public async Task<int> RecordReplayedTradesAsync(IReadOnlyList<TradeInput> replayed, string exposureLogFolder, CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var logged = LoggedTrades.Read(exposureLogFolder);
            var batch = new ExposureLogBatch();
            foreach (var trade in replayed.Where(t => logged.Add((t.TradeId, t.Version))))
            {
                batch.Add(ExposureLogKinds.TradeApplied, trade.TradeTime, new ExposureLogCause(null, "journal-replay"), TradePayload(trade));
            }
            await WriteLogAsync(batch, cancellationToken).ConfigureAwait(false);
            return batch.Count;
        }
        finally
        {
            _gate.Release();
        }
    }

    private static Dictionary<string, object?> TradePayload(TradeInput trade) => new()
    {
        ["tradeId"] = trade.TradeId,
        ["version"] = trade.Version,
        ["action"] = trade.Action.ToString().ToLowerInvariant(),
        ["book"] = trade.Book,
        ["instrumentId"] = trade.InstrumentId,
        ["faceAmount"] = trade.FaceAmount,
        ["cleanPrice"] = trade.CleanPrice,
    };

    private static ExposureLogCause LogCause(Cause cause) =>
        new(string.IsNullOrEmpty(cause.MessageId) ? null : cause.MessageId, cause.MessageType);

    [LoggerMessage(Message = "Limit {LimitId} ({Scope} {ScopeId}, {Measure}) is {Status}, was {PreviousStatus}: value {Value} against bound {Bound}")]
    private partial void LogLimitStatus(LogLevel level, string limitId, string scope, string scopeId, string measure, string status, string previousStatus, double value, double bound);

    [LoggerMessage(Level = LogLevel.Information, Message = "Trade {TradeId} version {Version} ignored: {Outcome}")]
    private partial void LogTradeIgnored(string tradeId, int version, string outcome);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Quote for {InstrumentId} dropped: {Reason}")]
    private partial void LogQuoteDropped(string instrumentId, string reason);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Stop record not written: storage is failing ({Faults})")]
    private partial void LogStopSkipped(string faults);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Curve {Curve} refit rejected, last good curve kept: {Reasons}")]
    private partial void LogCurveRejected(string curve, string reasons);

    internal static string Invariant(double value) => value.ToString("G", CultureInfo.InvariantCulture);
}
