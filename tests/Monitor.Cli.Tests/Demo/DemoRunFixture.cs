using Monitor.Cli.Demo;

namespace Monitor.Cli.Tests.Demo;

/// <summary>Runs the demo once for <see cref="DemoRunTests"/>: speed 10 (the day in about 6 s), plain output, the default seed, bounded by a 90 s timeout.</summary>
public sealed class DemoRunFixture : IAsyncLifetime
{
    private readonly string _workDir = Path.Combine(Path.GetTempPath(), "monitor-demo-test-" + Guid.NewGuid().ToString("N"));
    private readonly StringWriter _output = new();

    internal DemoOutcome Outcome { get; private set; } = null!;

    public string Output => _output.ToString();

    public async Task InitializeAsync()
    {
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(90));
        Outcome = await DemoRunner.RunAsync(new DemoOptions(_workDir, Speed: 10, Live: false), _output, console: null, timeout.Token);
    }

    public Task DisposeAsync()
    {
        _output.Dispose();
        if (Directory.Exists(_workDir) && Environment.GetEnvironmentVariable("MONITOR_KEEP_DEMO") is null)
        {
            Directory.Delete(_workDir, recursive: true);
        }
        return Task.CompletedTask;
    }
}
