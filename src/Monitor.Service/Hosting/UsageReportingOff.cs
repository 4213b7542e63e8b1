using MassTransit;
using MassTransit.UsageTracking;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace Monitor.Service.Hosting;

/// <summary>
/// Turns off MassTransit's usage telemetry: from 8.3 on, a bus built through <c>AddMassTransit</c> posts a report of
/// its configuration (versions, OS, time zone, endpoints, cloud region) to usage-tracking.masstransit.io about five
/// minutes after start, on by default. Two locks, because one is not enough: <c>DisableUsageTelemetry</c> sets
/// <see cref="UsageTelemetryOptions.Enabled"/> false, but MassTransit's tracker sets it back to true when the
/// environment variable <c>MASSTRANSIT_USAGE_TELEMETRY</c> says so; the tracker itself is therefore replaced by one
/// that does nothing, so no setting outside the code can start the report. Buses built with <c>Bus.Factory</c>
/// (the load tool's publisher) never look the tracker up and never report.
/// </summary>
public static class UsageReportingOff
{
    public static void Apply(IBusRegistrationConfigurator bus)
    {
        ArgumentNullException.ThrowIfNull(bus);
        bus.DisableUsageTelemetry();
        bus.Replace(ServiceDescriptor.Singleton<IUsageTracker, SilentUsageTracker>());
    }

    /// <summary>Collects nothing and sends nothing.</summary>
    internal sealed class SilentUsageTracker : IUsageTracker
    {
        public void PreConfigureBus<T>(T configurator, IBusRegistrationContext context)
            where T : IBusFactoryConfigurator
        {
        }

        public void PreConfigureRider<T>(T configurator)
            where T : IRiderFactoryConfigurator
        {
        }
    }
}
