using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace Monitor.Service.Journal;

/// <summary>
/// Health of the trade journal: unhealthy from a failed write until the next successful one. Meanwhile trade
/// appends throw, so trade messages are not acknowledged and come back: nothing is lost.
/// </summary>
public sealed class JournalHealthCheck(TradeJournal journal) : IHealthCheck
{
    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var data = new Dictionary<string, object> { ["records"] = journal.RecordCount, ["flushes"] = journal.FlushCount };
        var result = journal.IsHealthy
            ? HealthCheckResult.Healthy("trade journal writable", data)
            : HealthCheckResult.Unhealthy($"trade journal write failed: {journal.LastError}", null, data);
        return Task.FromResult(result);
    }
}
