using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace Monitor.Service.Audit;

/// <summary>
/// Health of the exposure log: unhealthy from a failed write until the next successful one
/// (the service should stop acknowledging messages meanwhile, so nothing is lost).
/// </summary>
public sealed class ExposureLogHealthCheck(ExposureLogWriter writer) : IHealthCheck
{
    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var data = new Dictionary<string, object> { ["lastSeq"] = writer.LastSeq, ["lastMac"] = writer.LastMac };
        var error = writer.LastError;
        var result = writer.IsHealthy
            ? HealthCheckResult.Healthy("exposure log writable", data)
            : HealthCheckResult.Unhealthy($"exposure log write failed: {error?.Message}", error, data);
        return Task.FromResult(result);
    }
}
