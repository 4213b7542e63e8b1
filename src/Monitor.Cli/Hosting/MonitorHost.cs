using MassTransit;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Consumers;
using Monitor.Service.Hosting;
using Monitor.Service.Journal;
using Monitor.Service.Storage;
using Serilog;

namespace Monitor.Cli.Hosting;

/// <summary>
/// Builds the service as a Generic Host: configuration given by the caller, Serilog as the only logger,
/// and <see cref="ServiceRegistration.AddMonitorService"/> for the rest. Used by <c>monitor run</c> and <c>monitor demo</c>.
/// </summary>
internal static class MonitorHost
{
    /// <summary>
    /// The host of <c>monitor run</c>: <paramref name="configFile"/> (JSON) overlaid by environment variables
    /// (<c>Transport__Kind=RabbitMq</c> sets <c>Transport:Kind</c>). Logging follows the file's <c>Serilog</c>
    /// section; without one, information and above go to the console.
    /// </summary>
    public static IHost ForService(string configFile)
    {
        var builder = Host.CreateApplicationBuilder(new HostApplicationBuilderSettings { DisableDefaults = true });
        builder.Configuration.AddJsonFile(Path.GetFullPath(configFile), optional: false, reloadOnChange: false);
        builder.Configuration.AddEnvironmentVariables();
        var configuration = builder.Configuration;
        var brokerStart = new BrokerStartLogFilter();
        builder.Services.AddSingleton(brokerStart);
        builder.Services.AddSerilog((services, logger) =>
        {
            logger.Filter.With(brokerStart);
            if (configuration.GetSection("Serilog").Exists())
            {
                logger.ReadFrom.Configuration(configuration).ReadFrom.Services(services).Filter.With(new RefusalLogEvents());
            }
            else
            {
                logger.MinimumLevel.Information()
                    // A refused message is one Warning line of the service's; MassTransit's own Error line with the stack is dropped.
                    .Filter.With(new RefusalLogEvents())
                    .MinimumLevel.Override("MassTransit", Serilog.Events.LogEventLevel.Warning)
                    // HealthStatusFilePublisher logs each change of health; the check service would log every failing run.
                    .MinimumLevel.Override("Microsoft.Extensions.Diagnostics.HealthChecks", Serilog.Events.LogEventLevel.Fatal)
                    .WriteTo.Console(formatProvider: System.Globalization.CultureInfo.InvariantCulture);
            }
        }, preserveStaticLogger: true);
        builder.Services.AddMonitorService(configuration);
        return builder.Build();
    }

    /// <summary>
    /// Reads every options section once, so that their validators run before anything is started. The service
    /// validates on start too, but the RabbitMQ bus is built (and fails on missing credentials with a bare
    /// <see cref="InvalidOperationException"/>) before the start-up validation runs.
    /// </summary>
    /// <exception cref="AggregateException">One or more sections are invalid: <see cref="OptionsValidationException"/>s whose failures name the key and the fix.</exception>
    public static void ValidateOptions(IServiceProvider services)
    {
        var failures = new List<Exception>();
        Read<MonitorOptions>(services, failures);
        Read<TransportOptions>(services, failures);
        Read<ExposureLogOptions>(services, failures);
        Read<RecordOptions>(services, failures);
        Read<StorageOptions>(services, failures);
        Read<HealthOptions>(services, failures);
        Read<JournalOptions>(services, failures);
        if (failures.Count > 0)
        {
            throw new AggregateException(failures);
        }
    }

    private static void Read<T>(IServiceProvider services, List<Exception> failures)
        where T : class
    {
        try
        {
            _ = services.GetRequiredService<IOptions<T>>().Value;
        }
        catch (OptionsValidationException ex)
        {
            failures.Add(ex);
        }
        catch (InvalidOperationException ex) when (ex.Message.StartsWith("Failed to convert configuration value", StringComparison.Ordinal))
        {
            // A word where a bool or a number goes: the binder's message names the key; StartupFailure turns it into the fix.
            failures.Add(ex);
        }
    }

    /// <summary>
    /// A host with configuration from memory (the demo): <paramref name="settings"/> are flat keys such as
    /// <c>Monitor:LimitsFile</c>; <paramref name="configureLogging"/> sets up Serilog; <paramref name="configureServices"/>
    /// runs before the service is added (a <see cref="TimeProvider"/> registered there replaces the system clock).
    /// </summary>
    public static IHost InProcess(
        IReadOnlyDictionary<string, string?> settings,
        Action<LoggerConfiguration> configureLogging,
        Action<IServiceCollection> configureServices,
        Action<IBusRegistrationConfigurator> extraConsumers)
    {
        var builder = Host.CreateApplicationBuilder(new HostApplicationBuilderSettings { DisableDefaults = true });
        builder.Configuration.AddInMemoryCollection(settings);
        // A logger of this host's own (not the static Log.Logger): several hosts may share a process (tests).
        var logger = new LoggerConfiguration().Filter.With(new RefusalLogEvents());
        configureLogging(logger);
        builder.Services.AddSerilog(logger.CreateLogger(), dispose: true);
        configureServices(builder.Services);
        builder.Services.AddMonitorService(builder.Configuration, extraConsumers);
        return builder.Build();
    }
}
