using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Ends temporary limits on the business clock: every <see cref="CheckEvery"/> of the service's <see cref="TimeProvider"/>
/// it asks the pipeline to expire the limits whose <c>expiresAt</c> has passed (each ends with a change to "expired",
/// a record and an event). Refits do the same check, so an expiry during a busy spell is not held back to the next tick.
/// </summary>
public sealed partial class LimitExpiryWorker(RiskPipeline pipeline, TimeProvider time, ILogger<LimitExpiryWorker> logger) : BackgroundService
{
    /// <summary>How often the clock is compared with the limits' expiries (a scan of the limits, no figures computed).</summary>
    public static readonly TimeSpan CheckEvery = TimeSpan.FromSeconds(1);

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(CheckEvery, time);
        while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
        {
            var expired = await pipeline.ExpireLimitsAsync(stoppingToken).ConfigureAwait(false);
            if (expired > 0)
            {
                LogExpired(expired, time.GetUtcNow());
            }
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "{Count} temporary limits expired at {Now:O}; each ended with status expired")]
    private partial void LogExpired(int count, DateTimeOffset now);
}
