using MassTransit;
using MassTransit.UsageTracking;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Hosting;

/// <summary>
/// MassTransit 8.x posts usage telemetry to a third party a few minutes after a bus starts, unless told not to
/// (MassTransit 8.5.12: <c>UsageTracker</c>, registered by <c>AddMassTransit</c>, on by default). The service's
/// wiring must turn it off for every transport, whatever the environment says.
/// </summary>
public sealed class UsageReportingTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData("InMemory")]
    [InlineData("RabbitMq")]
    public void The_bus_registration_reports_no_usage(string transport)
    {
        var settings = ServiceUnderTest.Settings(_folder.Combine("log"));
        settings["Transport:Kind"] = transport;
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(settings).Build();
        var services = new ServiceCollection();
        services.AddLogging();
        services.AddMonitorService(configuration);
        using var provider = services.BuildServiceProvider();

        Assert.False(provider.GetRequiredService<IOptions<UsageTelemetryOptions>>().Value.Enabled);
        // MassTransit's own tracker re-reads MASSTRANSIT_USAGE_TELEMETRY; the one registered must not be it.
        var tracker = provider.GetRequiredService<IUsageTracker>();
        Assert.IsNotType<UsageTracker>(tracker);
        Assert.Single(services, d => d.ServiceType == typeof(IUsageTracker));
    }
}
