using MassTransit;
using MassTransit.UsageTracking;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using Monitor.Cli.Hosting;

namespace Monitor.Cli.Tests.Load;

/// <summary>
/// The hosts the CLI builds (<c>monitor run</c>, <c>demo</c>, and the service inside <c>monitor load</c>) report no
/// MassTransit usage telemetry (MassTransit 8.5.12 <c>UsageTracker</c>, on by default through <c>AddMassTransit</c>).
/// The load tool's publisher bus is built with <c>Bus.Factory</c>, which never consults a usage tracker.
/// </summary>
public sealed class UsageReportingTests
{
    [Fact]
    public void The_in_process_host_reports_no_usage()
    {
        var settings = new Dictionary<string, string?> { ["Transport:Kind"] = "RabbitMq" };
        using var host = MonitorHost.InProcess(settings, _ => { }, _ => { }, _ => { });

        Assert.False(host.Services.GetRequiredService<IOptions<UsageTelemetryOptions>>().Value.Enabled);
        Assert.IsNotType<UsageTracker>(host.Services.GetRequiredService<IUsageTracker>());
    }
}
