using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace Monitor.Service.Pipeline;

/// <summary>Degraded while the limits file cannot be read or is refused (the last good limits stay in force), with the reason.</summary>
public sealed class LimitsHealthCheck(LimitsFileStatus status) : IHealthCheck
{
    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default) =>
        Task.FromResult(status.Problem is { } problem
            ? HealthCheckResult.Degraded(problem)
            : HealthCheckResult.Healthy("the limits file in force is the file on disk"));
}
