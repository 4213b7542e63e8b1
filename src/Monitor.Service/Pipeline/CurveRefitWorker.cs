using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// The refit loop: waits until quotes wait for a refit, then refits at once unless the previous refit started less
/// than the conflation window ago, in which case it waits out the rest of the window. A quote after a quiet spell
/// is fitted immediately (no added latency); during a burst at most one refit runs per window, on the latest quote
/// of each bond, and quotes arriving while a refit runs are taken by the next one.
/// </summary>
public sealed partial class CurveRefitWorker(RiskPipeline pipeline, IOptions<MonitorOptions> options, TimeProvider time, ILogger<CurveRefitWorker> logger)
    : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var window = options.Value.ConflationWindow;
        // Start-up counts as a refit (the opening curves are fitted then), so the first burst is gathered too.
        var lastStart = time.GetTimestamp();
        while (await pipeline.RefitRequests.WaitToReadAsync(stoppingToken).ConfigureAwait(false))
        {
            if (time.GetElapsedTime(lastStart) is var since && since < window)
            {
                await Task.Delay(window - since, time, stoppingToken).ConfigureAwait(false);
            }
            pipeline.RefitRequests.TryRead(out _);
            lastStart = time.GetTimestamp();
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
