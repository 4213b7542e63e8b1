using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Hosting;
using Monitor.Service.Pipeline;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// Issue 10: an unreadable limits file during the day (a folder in its place; as root, chmod does not stop a read) stopped
/// the host with exit code 0 and left health Healthy. Now the last good limits stay, the <c>limits</c> check turns
/// Degraded with the reason, and the watcher keeps running: a good file later is taken again.
/// </summary>
public sealed class LimitsFileRefusalTests : IDisposable
{
    private const string Extra = """{ "id": "t-extra", "scope": "book", "scopeId": "RATES-CORE", "measure": "dv01", "upper": 1000000 }""";

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task An_unreadable_limits_file_keeps_the_last_good_limits_and_degrades_health_without_stopping()
    {
        var limits = TestMarket.WriteLimits(_folder.Path);
        await using var service = await ServiceUnderTest.StartAsync(limits);
        // First a good change, taken once the watcher watches (it starts in the background; a change before would be missed).
        var extra = await File.ReadAllTextAsync(TestMarket.WriteLimits(_folder.Path, Extra));
        await ServiceUnderTest.WaitUntilAsync(async () =>
        {
            await File.WriteAllTextAsync(limits, extra);
            await Task.Delay(200);
            return await service.Pipeline.ReadAsync(e => e.Limits.Limits.Any(l => l.Id == "t-extra"));
        }, "the good change taken");
        var before = await service.Pipeline.ReadAsync(e => e.Limits.Limits.Select(l => l.Id).ToArray());

        File.Delete(limits);
        Directory.CreateDirectory(limits); // a folder in the file's place: unreadable as a file

        var degraded = await WaitForLimitsCheckAsync(service, HealthStatus.Degraded);
        Assert.Contains(limits, degraded.Description, StringComparison.Ordinal);
        Assert.Contains("cannot be read", degraded.Description, StringComparison.Ordinal);
        Assert.Equal(before, await service.Pipeline.ReadAsync(e => e.Limits.Limits.Select(l => l.Id).ToArray()));
        var watcher = service.Services.GetServices<IHostedService>().OfType<LimitsFileWatcher>().Single();
        Assert.False(watcher.ExecuteTask!.IsCompleted, $"the watcher ended: {watcher.ExecuteTask.Exception}");

        Directory.Delete(limits);
        await File.WriteAllTextAsync(limits, extra);
        await WaitForLimitsCheckAsync(service, HealthStatus.Healthy);
    }

    private static async Task<HealthReportEntry> WaitForLimitsCheckAsync(ServiceUnderTest service, HealthStatus wanted)
    {
        var health = service.Services.GetRequiredService<HealthCheckService>();
        HealthReportEntry? entry = null;
        // The watcher polls the file (PhysicalFileProvider, about every 4 s); WaitUntilAsync gives up after 30 s.
        try
        {
            await ServiceUnderTest.WaitUntilAsync(async () =>
            {
                var report = await health.CheckHealthAsync(r => r.Name == "limits");
                entry = report.Entries.TryGetValue("limits", out var e) ? e : null;
                return entry?.Status == wanted;
            }, $"limits health check {wanted}");
        }
        catch (TimeoutException ex)
        {
            throw new Xunit.Sdk.XunitException($"{ex.Message}; last entry: {entry?.Status} {entry?.Description}");
        }
        return entry!.Value;
    }
}
