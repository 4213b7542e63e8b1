using System.CommandLine;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Monitor.Cli.Hosting;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor run [--config FILE]</c>: runs the service until Ctrl+C (or SIGTERM), which stops it cleanly and writes the
/// day-end snapshot. Exit 0 after a clean stop, 2 when the configuration is refused (the reasons go to stderr).
/// </summary>
internal static class RunVerb
{
    public const int ConfigurationRefused = 2;

    public static Command Create()
    {
        var config = new Option<FileInfo>("--config")
        {
            Description = "Service configuration (JSON; sections Monitor, Transport, ExposureLog, Journal, Storage, Health, Serilog; every key in config/README.md). Environment variables override it: Transport__Kind=RabbitMq.",
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
            var configuration = host.Services.GetRequiredService<IConfiguration>();
            try
            {
                MonitorHost.ValidateOptions(host.Services);
                host.Services.GetRequiredService<IHostApplicationLifetime>().ApplicationStarted.Register(host.Services.GetRequiredService<BrokerStartLogFilter>().Started);
                await host.RunAsync(cancellationToken).ConfigureAwait(false);
                return 0;
            }
            catch (Exception ex)
            {
                if (BrokerStartFailure.Describe(ex, configuration) is { } broker)
                {
                    await error.WriteLineAsync(broker).ConfigureAwait(false);
                    return ConfigurationRefused;
                }
                var problems = StartupFailure.ConfigurationProblems(ex, configuration);
                if (problems.Count == 0)
                {
                    throw;
                }
                await error.WriteLineAsync($"monitor run: the configuration in {configFile.FullName} was refused:").ConfigureAwait(false);
                foreach (var problem in problems)
                {
                    await error.WriteLineAsync($"  {problem}").ConfigureAwait(false);
                }
                return ConfigurationRefused;
            }
        }
    }
}
