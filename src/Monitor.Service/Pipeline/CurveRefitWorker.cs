using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// The refit loop: waits until quotes mark a curve dirty, lets a short conflation window pass so a burst
/// lands in one snapshot, then refits once. While a refit runs new quotes only set the flag again.
/// </summary>
public sealed partial class CurveRefitWorker(RiskPipeline pipeline, IOptions<MonitorOptions> options, TimeProvider time, ILogger<CurveRefitWorker> logger)
    : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var window = options.Value.ConflationWindow;
        while (await pipeline.RefitRequests.WaitToReadAsync(stoppingToken).ConfigureAwait(false))
        {
            if (window > TimeSpan.Zero)
            {
                await Task.Delay(window, time, stoppingToken).ConfigureAwait(false);
            }
            pipeline.RefitRequests.TryRead(out _);
            try
            {
                await pipeline.RefitAsync(stoppingToken).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is not OperationCanceledException)
            {
                // The quotes stay dirty: the next signal retries. A failed log write lands here too.
                LogRefitFailed(ex);
                await Task.Delay(TimeSpan.FromSeconds(1), time, stoppingToken).ConfigureAwait(false);
            }
        }
    }

    [LoggerMessage(Level = LogLevel.Error, Message = "Curve refit failed; will retry on the next quote")]
    private partial void LogRefitFailed(Exception ex);
}
