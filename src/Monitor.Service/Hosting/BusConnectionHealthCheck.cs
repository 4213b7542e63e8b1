using MassTransit;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace Monitor.Service.Hosting;

/// <summary>
/// Health of the broker connection: Unhealthy unless every receive endpoint is connected. MassTransit's own bus check
/// reports a lost broker as Degraded (its endpoints retrying); for a limit monitor, not consuming is not degraded.
/// </summary>
public sealed class BusConnectionHealthCheck(IBusControl bus) : IHealthCheck
{
    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var health = bus.CheckHealth();
        var result = health.Status == BusHealthStatus.Healthy
            ? HealthCheckResult.Healthy(health.Description)
            : HealthCheckResult.Unhealthy($"bus {health.Status.ToString().ToLowerInvariant()}: {health.Description}");
        return Task.FromResult(result);
    }
}
