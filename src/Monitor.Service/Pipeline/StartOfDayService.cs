using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Files;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Journal;
using Monitor.Service.Storage;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Runs once the bus is up: builds the engine (instruments, positions, limits: a bad file stops the start; then
/// every journal day since the start-of-day state replayed), reports what the replay did and logs and publishes its refit, then fits the opening curves from the opening quotes file when one is configured, publishing the result.
/// </summary>
public sealed partial class StartOfDayService(
    RiskPipeline pipeline, EngineRecovery recovery, IOptions<MonitorOptions> options, IOptions<ExposureLogOptions> log,
    ExposureLogWriter writer, StorageFaultGate storage, TimeProvider time, ILogger<StartOfDayService> logger)
    : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        var (date, books, instruments, limits) = await pipeline.ReadAsync(e => (e.ValuationDate, e.Books.Count, e.Instruments.Count, e.Limits.Limits.Count), cancellationToken).ConfigureAwait(false);
        LogStarted(date, books, instruments);
        if (limits == 0)
        {
            LogNoLimits(options.Value.LimitsFile);
        }
        if (recovery.StartOfDay is { } state)
        {
            LogStartOfDay(state.Reason, string.Join(", ", recovery.Journal.Days.Select(Path.GetFileName)));
        }
        var replay = recovery.Result;
        if (replay.Applied + replay.Duplicates + replay.Superseded + replay.Definitions + replay.QuotesAccepted > 0 || recovery.Journal.Problems.Count > 0)
        {
            LogRecovered(replay.Applied, replay.Duplicates, replay.Superseded, replay.Definitions, replay.QuotesAccepted, replay.RejectedQuotes.Count);
        }
        foreach (var refused in replay.RejectedQuotes)
        {
            LogQuoteNotReplayed(refused);
        }
        foreach (var problem in recovery.Journal.Problems)
        {
            LogJournalProblem(problem.ToString());
        }
        foreach (var loss in recovery.Losses)
        {
            // Journal:AcceptLoss let the start through: each loss goes on record before anything else happens.
            LogJournalLoss(loss);
            var payload = new Dictionary<string, object?> { ["journal"] = Path.GetFileName(recovery.Journal.Path), ["loss"] = loss };
            await storage.RunAsync(StorageFaultGate.ExposureLog,
                () => writer.Append(ExposureLogKinds.JournalLoss, time.GetUtcNow(), new ExposureLogCause(null, "journal-accept-loss"), payload),
                cancellationToken).ConfigureAwait(false);
        }
        var restored = await pipeline.RecordReplayedTradesAsync(recovery.Journal.Trades, log.Value.Folder, cancellationToken).ConfigureAwait(false);
        if (restored > 0)
        {
            LogAuditRestored(restored);
        }
        if (replay.Refit.Curves.Count + replay.Refit.StatusChanges.Count + replay.Refit.Books.Count > 0)
        {
            // The replay's refit changed curves, books and limit statuses before the pipeline ran: record and publish it.
            await pipeline.CommitRecoveryAsync(replay.Refit, cancellationToken).ConfigureAwait(false);
        }
        if (options.Value.OpeningQuotesFile is { Length: > 0 } path)
        {
            var quotes = QuoteFile.Read(path);
            foreach (var quote in quotes)
            {
                await pipeline.AcceptQuoteAsync(quote, new Cause("opening-quotes", string.Empty, quote.QuoteTime), cancellationToken).ConfigureAwait(false);
            }
            await pipeline.RefitAsync(cancellationToken).ConfigureAwait(false);
            LogOpeningFit(quotes.Count, path);
        }
    }

    /// <summary>Stopped after the refit loop and the stop records (hosted services stop in reverse order), before the outbox and the bus.</summary>
    /// <remarks>Reads nothing under the pipeline's lock: a write stalled by a failing disk may hold it.</remarks>
    public Task StopAsync(CancellationToken cancellationToken)
    {
        LogStopped(recovery.Engine.ValuationDate);
        return Task.CompletedTask;
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Monitor stopping for valuation date {ValuationDate:yyyy-MM-dd}: refits ended, stop records written; publishing what is left, then closing the bus")]
    private partial void LogStopped(DateOnly valuationDate);

    [LoggerMessage(Level = LogLevel.Information, Message = "Monitor started for valuation date {ValuationDate:yyyy-MM-dd}: {Books} books, {Instruments} instruments")]
    private partial void LogStarted(DateOnly valuationDate, int books, int instruments);

    [LoggerMessage(Level = LogLevel.Information, Message = "Start-of-day state: {Reason}; journal files replayed: {Days}")]
    private partial void LogStartOfDay(string reason, string days);

    [LoggerMessage(Level = LogLevel.Information, Message = "Recovered from the trade journal: {Applied} trades applied, {Duplicates} duplicates, {Superseded} superseded, {Definitions} instrument definitions, {Quotes} quotes kept, {Rejected} quotes refused")]
    private partial void LogRecovered(int applied, int duplicates, int superseded, int definitions, int quotes, int rejected);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Journalled quote not replayed: {Refusal}")]
    private partial void LogQuoteNotReplayed(string refusal);

    [LoggerMessage(Level = LogLevel.Warning, Message = "The limits file {Path} lists no limits: no book, desk or firm is judged until limits are given")]
    private partial void LogNoLimits(string path);

    [LoggerMessage(Level = LogLevel.Warning, Message = "{Count} journalled trades had no trade-applied record (a crash between the journal and the log); written now with cause journal-replay")]
    private partial void LogAuditRestored(int count);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Trade journal problem found on replay: {Problem}")]
    private partial void LogJournalProblem(string problem);

    [LoggerMessage(Level = LogLevel.Error, Message = "Journal:AcceptLoss: started although {Loss}; written to the exposure log as a journal-loss record")]
    private partial void LogJournalLoss(string loss);

    [LoggerMessage(Level = LogLevel.Information, Message = "Opening curves fitted from {Count} quotes in {Path}")]
    private partial void LogOpeningFit(int count, string path);
}
