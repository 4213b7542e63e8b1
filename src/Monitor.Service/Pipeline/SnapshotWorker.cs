using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>Writes a snapshot of every book to the exposure log at the configured interval, and a day-end snapshot when the service stops.</summary>
public sealed partial class SnapshotWorker(RiskPipeline pipeline, IOptions<MonitorOptions> options, TimeProvider time, ILogger<SnapshotWorker> logger)
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
            await pipeline.SnapshotAsync(ExposureLogKinds.DayEnd, cancellationToken).ConfigureAwait(false);
        }
        catch (ExposureLogWriteException ex)
        {
            LogSnapshotFailed(ex);
        }
    }

    [LoggerMessage(Level = LogLevel.Error, Message = "Book snapshot could not be written to the exposure log")]
    private partial void LogSnapshotFailed(Exception ex);
}
