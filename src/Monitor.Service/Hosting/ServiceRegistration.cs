using MassTransit;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Hosting;

/// <summary>Wires the service: options validated on start, the engine, the pipeline and its workers, the exposure log, the bus, health.</summary>
public static class ServiceRegistration
{
    public static IServiceCollection AddMonitorService(this IServiceCollection services, IConfiguration configuration, Action<IBusRegistrationConfigurator>? extraConsumers = null)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        services.TryAddTimeProvider();
        services.AddOptions<MonitorOptions>().Bind(configuration.GetSection(MonitorOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<MonitorOptions>, MonitorOptionsValidator>();
        services.AddOptions<TransportOptions>().Bind(configuration.GetSection(TransportOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<TransportOptions>, TransportOptionsValidator>();
        services.AddOptions<ExposureLogOptions>().Bind(configuration.GetSection(ExposureLogOptions.SectionName))
            .Validate(o => o.Validate().Count == 0, "ExposureLog section is invalid: see the messages logged at start-up.")
            .ValidateOnStart();

        services.AddMetrics();
        services.AddSingleton<MonitorMetrics>();
        services.AddSingleton(sp => EngineFactory.Create(sp.GetRequiredService<IOptions<MonitorOptions>>().Value, sp.GetRequiredService<TimeProvider>()));
        services.AddSingleton(sp => new ExposureLogWriter(sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value, sp.GetRequiredService<TimeProvider>()));
        services.AddSingleton<RiskPipeline>();

        var transport = configuration.GetSection(TransportOptions.SectionName).Get<TransportOptions>() ?? new TransportOptions();
        services.AddMassTransit(bus =>
        {
            InboundEndpoints.AddConsumers(bus);
            extraConsumers?.Invoke(bus);
            if (transport.Kind == TransportKind.RabbitMq)
            {
                bus.UsingRabbitMq((context, cfg) =>
                {
                    BrokerConnection.Configure(cfg, transport.Broker);
                    InboundEndpoints.Configure(context, cfg, transport);
                    cfg.ConfigureEndpoints(context);
                });
            }
            else
            {
                bus.UsingInMemory((context, cfg) =>
                {
                    InboundEndpoints.Configure(context, cfg, transport);
                    cfg.ConfigureEndpoints(context);
                });
            }
        });

        // Started after the bus, in this order: opening curves, then the refit loop and the snapshots.
        services.AddHostedService<StartOfDayService>();
        services.AddHostedService<CurveRefitWorker>();
        services.AddHostedService<SnapshotWorker>();
        services.AddHostedService<LimitsFileWatcher>();
        services.AddHealthChecks()
            .AddCheck<ExposureLogHealthCheck>("exposure-log")
            .AddCheck<CurveHealthCheck>("curves");
        return services;
    }

    private static void TryAddTimeProvider(this IServiceCollection services)
    {
        if (!services.Any(d => d.ServiceType == typeof(TimeProvider)))
        {
            services.AddSingleton(TimeProvider.System);
        }
    }
}
