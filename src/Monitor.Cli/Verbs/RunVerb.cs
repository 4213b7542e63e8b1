using System.CommandLine;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Monitor.Cli.Hosting;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor run [--config FILE]</c>: runs the service until Ctrl+C (or SIGTERM), which stops it cleanly and writes the
/// stop record (`stop-snapshot` per book, then `service-stopped`; the day's close is written only when the roll passes). Exit 0 after a
/// clean stop, 2 when the configuration is refused, a folder is in use by another instance, or the journal or exposure log fails its
/// check at start (the reasons go to stderr), 5 when a fault stopped the service.
/// </summary>
internal static class RunVerb
{
    public const int ConfigurationRefused = 2;

    /// <summary>Exit code when a fault stopped the running service (never 0 after a fault).</summary>
    public const int ServiceFaulted = 5;

    public static Command Create()
    {
        var config = new Option<FileInfo>("--config")
        {
            Description = "Service configuration (JSON; sections Monitor, Transport, ExposureLog, Journal, Record, Retention, Storage, Health, Serilog; every key in config/README.md; the record key from Record:KeyFile or MONITOR_RECORD_KEY). Environment variables override it: Transport__Kind=RabbitMq.",
            DefaultValueFactory = _ => new FileInfo(Path.Combine("config", "service.json")),
        };
        var command = new Command("run", "Run the monitor service on the transport the configuration names (InMemory or RabbitMq) until stopped.");
        command.Options.Add(config);
        command.SetAction((parse, cancellationToken) => RunAsync(parse.GetValue(config)!, Console.Error, cancellationToken));
        return command;
    }

    private static IConfiguration ReadConfiguration(FileInfo configFile) =>
        new ConfigurationBuilder().AddJsonFile(configFile.FullName, optional: false, reloadOnChange: false).AddEnvironmentVariables().Build();

    /// <summary>Runs the service from <paramref name="configFile"/> until <paramref name="cancellationToken"/> fires or the host is told to stop; configuration problems go to <paramref name="error"/>.</summary>
    public static async Task<int> RunAsync(FileInfo configFile, TextWriter error, CancellationToken cancellationToken)
    {
        if (!configFile.Exists)
        {
            await error.WriteLineAsync($"--config: '{configFile.FullName}' does not exist; give the path of the service configuration, e.g. config/service.json.").ConfigureAwait(false);
            return ConfigurationRefused;
        }
        IHost host;
        try
        {
            host = MonitorHost.ForService(configFile.FullName);
        }
        catch (InvalidDataException ex)
        {
            await error.WriteLineAsync($"--config: '{configFile.FullName}' is not valid JSON: {ex.Message}").ConfigureAwait(false);
            return ConfigurationRefused;
        }
        catch (InvalidOperationException ex) when (ConfigurationValueFix.Describe(ex, ReadConfiguration(configFile)) is { } problem)
        {
            // The transport section is read while the service is wired, before any validator runs.
            await error.WriteLineAsync($"monitor run: the configuration in {configFile.FullName} was refused:").ConfigureAwait(false);
            await error.WriteLineAsync($"  {problem}").ConfigureAwait(false);
            return ConfigurationRefused;
        }
        using (host)
        {
            return await RunHostAsync(host, configFile.FullName, error, cancellationToken).ConfigureAwait(false);
        }
    }

    /// <summary>
    /// Runs a built host until it stops: 0 after a clean stop, <see cref="ConfigurationRefused"/> when the start is refused
    /// (bad configuration, a folder another instance writes), <see cref="ServiceFaulted"/> when a fault stopped it.
    /// </summary>
    internal static async Task<int> RunHostAsync(IHost host, string configFile, TextWriter error, CancellationToken cancellationToken)
    {
        var configuration = host.Services.GetRequiredService<IConfiguration>();
        try
        {
            MonitorHost.ValidateOptions(host.Services);
            if (host.Services.GetService<BrokerStartLogFilter>() is { } brokerStart)
            {
                host.Services.GetRequiredService<IHostApplicationLifetime>().ApplicationStarted.Register(brokerStart.Started);
            }
            // Not RunAsync: it disposes the host, and the faults are read from its services below.
            await host.StartAsync(cancellationToken).ConfigureAwait(false);
            await host.WaitForShutdownAsync(cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex)
        {
            if (BrokerStartFailure.Describe(ex, configuration) is { } broker)
            {
                await error.WriteLineAsync(broker).ConfigureAwait(false);
                return ConfigurationRefused;
            }
            if (StartupFailure.FolderInUse(ex) is { } inUse)
            {
                await error.WriteLineAsync($"monitor run: {inUse.Message}").ConfigureAwait(false);
                return ConfigurationRefused;
            }
            if (StartupFailure.RefusedRecord(ex) is { } refused)
            {
                // A journal line failing its check, books that disagree with the log, a log whose end fails its MAC.
                await error.WriteLineAsync($"monitor run: the start was stopped: {refused.Message}").ConfigureAwait(false);
                return ConfigurationRefused;
            }
            var problems = StartupFailure.ConfigurationProblems(ex, configuration);
            if (problems.Count == 0)
            {
                throw;
            }
            await error.WriteLineAsync($"monitor run: the configuration in {configFile} was refused:").ConfigureAwait(false);
            foreach (var problem in problems)
            {
                await error.WriteLineAsync($"  {problem}").ConfigureAwait(false);
            }
            return ConfigurationRefused;
        }
        var faults = HostFaults.Of(host.Services);
        foreach (var (service, fault) in faults)
        {
            await error.WriteLineAsync($"monitor run: stopped by a fault in {service}: {fault.GetType().Name}: {fault.Message}").ConfigureAwait(false);
        }
        return faults.Count == 0 ? 0 : ServiceFaulted;
    }
}
