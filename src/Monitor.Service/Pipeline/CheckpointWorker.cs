using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Storage;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Cuts an exposure log checkpoint every <see cref="RecordOptions.CheckpointInterval"/> on the business clock, and one
/// more when the service stops (registered after the outbox, so it stops first and the outbox still publishes it).
/// </summary>
public sealed partial class CheckpointWorker(ExposureLogCheckpointer checkpointer, IOptions<RecordOptions> options, TimeProvider time, ILogger<CheckpointWorker> logger)
    : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(options.Value.CheckpointInterval, time);
        try
        {
            while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
            {
                await checkpointer.WriteCheckpointAsync(ExposureLogCheckpointer.Interval, stoppingToken).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
    }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        await base.StopAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            await checkpointer.WriteCheckpointAsync(ExposureLogCheckpointer.Stop, cancellationToken).ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            LogStopCheckpointAbandoned();
        }
    }

    [LoggerMessage(Level = LogLevel.Error, Message = "The stop checkpoint of the exposure log was not written before the stop timeout: the records since the last checkpoint are unanchored")]
    private partial void LogStopCheckpointAbandoned();
}
