using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Monitor.Cli.Tests.Support;
using Monitor.Cli.Verbs;
using Monitor.Service.Storage;

namespace Monitor.Cli.Tests.Demo;

/// <summary><c>monitor run</c> refuses bad configuration before starting anything, naming each key and the fix, exit 2.</summary>
public sealed class RunVerbTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("monitor-run-test-").FullName;

    [Fact(Timeout = 60_000)]
    public async Task Every_bad_section_is_reported_on_the_error_writer_with_exit_code_2()
    {
        var config = Path.Combine(_dir, "service.json");
        await File.WriteAllTextAsync(config, """
            {
              "Monitor": { "InstrumentsFile": "no-such-instruments.csv", "LimitsFile": "no-such-limits.json" },
              "Transport": { "Kind": "InMemory", "ConcurrentMessageLimit": 0 },
              "ExposureLog": { "Folder": "" },
              "Serilog": { "MinimumLevel": "Fatal" }
            }
            """);
        using var error = new StringWriter();

        var exit = await RunVerb.RunAsync(new FileInfo(config), error, CancellationToken.None);

        Assert.Equal(RunVerb.ConfigurationRefused, exit);
        var text = error.ToString();
        Assert.Contains("Monitor:InstrumentsFile", text, StringComparison.Ordinal);
        Assert.Contains("Monitor:LimitsFile", text, StringComparison.Ordinal);
        Assert.Contains("Transport:ConcurrentMessageLimit", text, StringComparison.Ordinal);
        Assert.Contains("ExposureLog:Folder", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_missing_configuration_file_is_named()
    {
        using var error = new StringWriter();

        var exit = await RunVerb.RunAsync(new FileInfo(Path.Combine(_dir, "absent.json")), error, CancellationToken.None);

        Assert.Equal(RunVerb.ConfigurationRefused, exit);
        Assert.Contains("absent.json", error.ToString(), StringComparison.Ordinal);
    }

    [Fact(Timeout = 60_000)]
    public async Task A_second_run_on_folders_another_instance_writes_exits_2_naming_the_folder_and_the_holder()
    {
        var log = Path.Combine(_dir, "exposure-log");
        await File.WriteAllTextAsync(Path.Combine(_dir, "limits.json"), """
            { "firm": "f", "desks": [ { "id": "d", "books": ["b"] } ], "limits": [ { "id": "l", "scope": "firm", "measure": "dv01", "upper": 1000 } ] }
            """);
        var config = Path.Combine(_dir, "service.json");
        await File.WriteAllTextAsync(config, $$"""
            {
              "Monitor": { "InstrumentsFile": "{{CliRun.Data("instruments.csv")}}", "LimitsFile": "{{Path.Combine(_dir, "limits.json")}}" },
              "Transport": { "Kind": "InMemory" },
              "ExposureLog": { "Folder": "{{log}}", "FlushToDisk": false },
              "Serilog": { "MinimumLevel": "Fatal" }
            }
            """);
        using var holder = FolderWriterLock.Take(log, "exposure log"); // the first instance
        using var error = new StringWriter();
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30)); // a run that did start would stop here with 0

        var exit = await RunVerb.RunAsync(new FileInfo(config), error, timeout.Token);

        Assert.Equal(RunVerb.ConfigurationRefused, exit);
        Assert.Contains(log, error.ToString(), StringComparison.Ordinal);
        Assert.Contains($"\"pid\":{Environment.ProcessId}", error.ToString(), StringComparison.Ordinal);
    }

    [Fact(Timeout = 60_000)]
    public async Task A_fault_that_stops_the_service_exits_non_zero_and_names_it()
    {
        // .NET 10 stops the host on a background service's exception but RunAsync completes normally: the exit code was 0.
        var builder = Host.CreateApplicationBuilder(new HostApplicationBuilderSettings { DisableDefaults = true });
        builder.Services.AddHostedService<FailingService>();
        using var host = builder.Build();
        using var error = new StringWriter();

        var exit = await RunVerb.RunHostAsync(host, "service.json", error, CancellationToken.None);

        Assert.Equal(RunVerb.ServiceFaulted, exit);
        Assert.Contains("FailingService", error.ToString(), StringComparison.Ordinal);
        Assert.Contains("limits file unreadable", error.ToString(), StringComparison.Ordinal);
    }

    private sealed class FailingService : BackgroundService
    {
        protected override async Task ExecuteAsync(CancellationToken stoppingToken)
        {
            await Task.Yield();
            throw new UnauthorizedAccessException("limits file unreadable");
        }
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);
}
