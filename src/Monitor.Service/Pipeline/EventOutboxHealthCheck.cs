using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Health of outbound publishing: unhealthy while the broker refuses the service's events (they wait in the outbox
/// and go out when it is back), degraded while more than <see cref="DegradedBacklog"/> changes wait.
/// </summary>
public sealed class EventOutboxHealthCheck(EventOutbox outbox) : IHealthCheck
{
    public const int DegradedBacklog = 1_000;

    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var backlog = outbox.Backlog;
        var data = new Dictionary<string, object> { ["backlog"] = backlog, ["published"] = outbox.Published };
        var result = outbox.LastError is { } error
            ? HealthCheckResult.Unhealthy($"publishing events failed, {backlog} change(s) waiting: {error}", null, data)
            : backlog > DegradedBacklog
                ? HealthCheckResult.Degraded($"{backlog} change(s) wait to be published", null, data)
                : HealthCheckResult.Healthy("events published", data);
        return Task.FromResult(result);
    }
}
