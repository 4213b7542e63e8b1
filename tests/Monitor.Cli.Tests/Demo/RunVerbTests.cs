using Monitor.Cli.Verbs;

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

    public void Dispose() => Directory.Delete(_dir, recursive: true);
}
