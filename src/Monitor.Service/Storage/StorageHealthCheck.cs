using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace Monitor.Service.Storage;

/// <summary>
/// Unhealthy while a durable write is failing and held by the <see cref="StorageFaultGate"/> (the pipeline is stalled and
/// messages wait unacknowledged); the description names each failing store, its path, the OS error and since when.
/// </summary>
public sealed class StorageHealthCheck(StorageFaultGate gate) : IHealthCheck
{
    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var faults = gate.Faults;
        if (faults.Count == 0)
        {
            return Task.FromResult(HealthCheckResult.Healthy("storage writable"));
        }
        var data = faults.ToDictionary(f => f.Store, f => (object)f.ToString(), StringComparer.Ordinal);
        return Task.FromResult(HealthCheckResult.Unhealthy("storage failing, pipeline stalled: " + string.Join("; ", faults), data: data));
    }
}
