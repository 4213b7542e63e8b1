using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// The refit loop: waits until quotes wait for a refit, then refits at once unless the previous refit started less
/// than the conflation window ago, in which case it waits out the rest of the window. A quote after a quiet spell
/// is fitted immediately (no added latency); during a burst at most one refit runs per window, on the latest quote
/// of each bond, and quotes arriving while a refit runs are taken by the next one. The loop also rests at least as
/// long as its last refit took, so refits of a large firm never take more than half of one core from the consumers.
/// </summary>
public sealed partial class CurveRefitWorker(RiskPipeline pipeline, IOptions<MonitorOptions> options, TimeProvider time, ILogger<CurveRefitWorker> logger)
    : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var window = options.Value.ConflationWindow;
        // Start-up counts as a refit (the opening curves are fitted then), so the first burst is gathered too.
        var lastStart = time.GetTimestamp();
        var lastTook = TimeSpan.Zero;
        while (await pipeline.RefitRequests.WaitToReadAsync(stoppingToken).ConfigureAwait(false))
        {
            var gap = window > 2 * lastTook ? window : 2 * lastTook;
            if (time.GetElapsedTime(lastStart) is var since && since < gap)
            {
                await Task.Delay(gap - since, time, stoppingToken).ConfigureAwait(false);
            }
            pipeline.RefitRequests.TryRead(out _);
            lastStart = time.GetTimestamp();
            try
            {
                await pipeline.RefitAsync(stoppingToken).ConfigureAwait(false);
                lastTook = time.GetElapsedTime(lastStart);
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
