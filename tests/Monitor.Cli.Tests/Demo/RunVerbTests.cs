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
    public async Task A_word_where_a_bool_or_a_transport_goes_names_the_key_and_the_fix_with_exit_code_2()
    {
        var config = Path.Combine(_dir, "service.json");
        await File.WriteAllTextAsync(config, """
            { "ExposureLog": { "Folder": "log", "FlushToDisk": "yes" }, "Serilog": { "MinimumLevel": "Fatal" } }
            """);
        using var error = new StringWriter();

        Assert.Equal(RunVerb.ConfigurationRefused, await RunVerb.RunAsync(new FileInfo(config), error, CancellationToken.None));
        Assert.Contains("ExposureLog:FlushToDisk: 'yes' is not a yes/no value; use true or false.", error.ToString(), StringComparison.Ordinal);

        await File.WriteAllTextAsync(config, """{ "Transport": { "Kind": "Rabbit" } }""");
        using var transport = new StringWriter();
        Assert.Equal(RunVerb.ConfigurationRefused, await RunVerb.RunAsync(new FileInfo(config), transport, CancellationToken.None));
        Assert.Contains("Transport:Kind: 'Rabbit' is not one of InMemory, RabbitMq.", transport.ToString(), StringComparison.Ordinal);
    }

    [Fact(Timeout = 60_000)]
    public async Task Missing_broker_credentials_are_reported_together()
    {
        var config = Path.Combine(_dir, "service.json");
        await File.WriteAllTextAsync(config, $$"""
            { "Transport": { "Kind": "RabbitMq", "Broker": { "UserFile": "{{Path.Combine(_dir, "no-user")}}", "PasswordFile": "{{Path.Combine(_dir, "no-password")}}" } },
              "Serilog": { "MinimumLevel": "Fatal" } }
            """);
        using var error = new StringWriter();

        Assert.Equal(RunVerb.ConfigurationRefused, await RunVerb.RunAsync(new FileInfo(config), error, CancellationToken.None));
        Assert.Contains("Transport:Broker:UserFile", error.ToString(), StringComparison.Ordinal);
        Assert.Contains("Transport:Broker:PasswordFile", error.ToString(), StringComparison.Ordinal);
    }

    [BrokerFact(Timeout = 120_000)]
    public async Task A_wrong_broker_password_is_one_line_and_exit_code_2()
    {
        var broker = BrokerFactAttribute.Broker!;
        var user = Uri.UnescapeDataString(broker.UserInfo.Split(':')[0]);
        await File.WriteAllTextAsync(Path.Combine(_dir, "user"), user);
        await File.WriteAllTextAsync(Path.Combine(_dir, "password"), "not-the-password");
        var vhost = broker.AbsolutePath.Length > 1 ? Uri.UnescapeDataString(broker.AbsolutePath[1..]) : "/";
        var repo = Path.GetFullPath(Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", ".."));
        var config = Path.Combine(_dir, "service.json");
        await File.WriteAllTextAsync(config, System.Text.Json.JsonSerializer.Serialize(new
        {
            Monitor = new
            {
                InstrumentsFile = Path.Combine(repo, "config", "demo", "instruments.csv"),
                PositionsFile = Path.Combine(repo, "config", "demo", "positions.csv"),
                LimitsFile = Path.Combine(repo, "config", "demo", "limits.json"),
            },
            Transport = new
            {
                Kind = "RabbitMq",
                Broker = new { Host = broker.Host, Port = broker.Port, VirtualHost = vhost, UserFile = Path.Combine(_dir, "user"), PasswordFile = Path.Combine(_dir, "password") },
            },
            ExposureLog = new { Folder = Path.Combine(_dir, "exposure-log") },
            Record = new { KeyFile = TestKey.FileIn(_dir) },
            Serilog = new { MinimumLevel = "Fatal" },
        }));
        using var error = new StringWriter();

        var exit = await RunVerb.RunAsync(new FileInfo(config), error, CancellationToken.None);

        Assert.Equal(RunVerb.ConfigurationRefused, exit);
        var line = Assert.Single(error.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains("refused the user name or password", line, StringComparison.Ordinal);
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
              "Record": { "KeyFile": "{{TestKey.FileIn(_dir)}}" },
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
