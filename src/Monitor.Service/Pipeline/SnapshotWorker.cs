using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Writes a snapshot of every book to the exposure log at the configured interval, and the stop record (each book's
/// <c>stop-snapshot</c>, then <c>service-stopped</c>) when the service stops: a stop, not a day's close (<see cref="DayCloseWorker"/>).
/// </summary>
public sealed partial class SnapshotWorker(RiskPipeline pipeline, IOptions<MonitorOptions> options, BusinessDayRoll roll, TimeProvider time, ILogger<SnapshotWorker> logger)
    : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var interval = options.Value.SnapshotInterval;
        if (interval <= TimeSpan.Zero)
        {
            return;
        }
        using var timer = new PeriodicTimer(interval, time);
        while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
        {
            try
            {
                await pipeline.SnapshotAsync(ExposureLogKinds.Snapshot, stoppingToken).ConfigureAwait(false);
            }
            catch (ExposureLogWriteException ex)
            {
                LogSnapshotFailed(ex);
            }
        }
    }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        await base.StopAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            await pipeline.RecordStopAsync(roll.BusinessDateOf(time.GetUtcNow()), cancellationToken).ConfigureAwait(false);
        }
        catch (ExposureLogWriteException ex)
        {
            LogSnapshotFailed(ex);
        }
    }

    [LoggerMessage(Level = LogLevel.Error, Message = "Book snapshot could not be written to the exposure log")]
    private partial void LogSnapshotFailed(Exception ex);
}
