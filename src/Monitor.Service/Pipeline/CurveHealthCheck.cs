using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Options;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>Healthy when the government curve is fitted, fresh, and its last refit passed the quality gate.</summary>
public sealed class CurveHealthCheck(RiskPipeline pipeline, IOptions<MonitorOptions> options, TimeProvider time) : IHealthCheck
{
    private static readonly TimeSpan LockWait = TimeSpan.FromSeconds(2);

    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        (string Label, bool Fitted, DateTimeOffset? FittedAt, bool Rejected, double? RmseBp)[] curves;
        using var wait = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        wait.CancelAfter(LockWait);
        try
        {
            curves = await pipeline.ReadAsync(e => e.Curves.Values.Select(c => (c.Label, c.Curve is not null, c.FittedAt, c.LastFitRejected, c.LastReport?.RmseBp)).ToArray(), wait.Token).ConfigureAwait(false);
        }
        catch (OperationCanceledException) when (!cancellationToken.IsCancellationRequested)
        {
            // A write held through a storage outage keeps the engine's lock: report that rather than hold up the other checks.
            return HealthCheckResult.Degraded($"the engine is busy: its lock was not free within {LockWait.TotalSeconds:0} s (a stalled write? see the storage check)");
        }
        var now = time.GetUtcNow();
        var data = new Dictionary<string, object>(StringComparer.Ordinal);
        var problems = new List<string>();
        foreach (var (label, fitted, at, rejected, rmse) in curves)
        {
            data[label] = fitted ? $"fitted {at:O}, rmse {rmse:F2} bp{(rejected ? ", last refit rejected" : string.Empty)}" : "not fitted";
            if (label == Engine.CurveKeyLabel.Government && !fitted)
            {
                problems.Add("the government curve is not fitted yet");
            }
            if (fitted && now - at > options.Value.StaleQuoteAfter)
            {
                problems.Add($"{label} curve is older than {options.Value.StaleQuoteAfter}");
            }
            if (rejected)
            {
                problems.Add($"{label} curve's last refit failed the quality gate");
            }
        }
        return problems.Count == 0
            ? HealthCheckResult.Healthy("curves fresh", data)
            : HealthCheckResult.Degraded(string.Join("; ", problems), data: data);
    }
}
