using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Monitor.Service.Engine;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Closes the business day when its roll (<c>Monitor:BusinessDay</c>) passes while the service runs: the pipeline
/// writes each valued book's <c>close-snapshot</c> and the <c>day-closed</c> record, then every
/// <see cref="IDayCloseListener"/> is told. A stop is not a close (the stop writes <c>service-stopped</c>). A clock that
/// jumps over several rolls (a suspended machine) closes the day it was in once, then waits for the next roll.
/// </summary>
public sealed partial class DayCloseWorker(RiskPipeline pipeline, BusinessDayRoll roll, IEnumerable<IDayCloseListener> listeners, TimeProvider time, ILogger<DayCloseWorker> logger)
    : BackgroundService
{
    // The day the service started in, read when the host builds the worker: .NET 10 runs ExecuteAsync on a pool
    // thread, so a clock that passes the roll before the loop's first read must still close the starting day.
    private readonly DateTimeOffset _startedAt = time.GetUtcNow();

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var first = true;
        while (!stoppingToken.IsCancellationRequested)
        {
            var now = first ? _startedAt : time.GetUtcNow();
            first = false;
            var day = roll.BusinessDateOf(now);
            var rollAt = roll.EndOf(day);
            // Timers can fire a little early: wait again until the clock has really passed the roll.
            while (time.GetUtcNow() < rollAt)
            {
                await Task.Delay(rollAt - time.GetUtcNow(), time, stoppingToken).ConfigureAwait(false);
            }
            var close = await pipeline.CloseDayAsync(day, rollAt, stoppingToken).ConfigureAwait(false);
            LogDayClosed(day, close.Books, close.LogSeq);
            foreach (var listener in listeners)
            {
                try
                {
                    await listener.OnDayClosedAsync(close, stoppingToken).ConfigureAwait(false);
                }
                catch (Exception ex) when (ex is not OperationCanceledException)
                {
                    LogListenerFailed(listener.GetType().Name, day, ex);
                }
            }
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Business day {Day:yyyy-MM-dd} closed: {Books} books in its close snapshot, day-closed record seq {Seq}")]
    private partial void LogDayClosed(DateOnly day, int books, long seq);

    [LoggerMessage(Level = LogLevel.Error, Message = "Day-close listener {Listener} failed for business day {Day:yyyy-MM-dd}")]
    private partial void LogListenerFailed(string listener, DateOnly day, Exception ex);
}
