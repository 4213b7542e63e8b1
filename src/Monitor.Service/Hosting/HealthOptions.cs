namespace Monitor.Service.Hosting;

/// <summary>
/// Configuration section <c>Health</c>: how the service reports its health without an HTTP endpoint. The health checks
/// run every <see cref="Period"/>; each change of the overall status is logged, and when <see cref="StatusFile"/> is set
/// the latest report is written there as JSON (for a probe, a supervisor or a test to read).
/// </summary>
public sealed class HealthOptions
{
    public const string SectionName = "Health";

    /// <summary>File that receives the latest health report (replaced atomically); none when blank. Put it off the log's disk.</summary>
    public string? StatusFile { get; set; }

    /// <summary>Time between two runs of the health checks. Default 10 s; at least 1 s.</summary>
    public TimeSpan Period { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>Problems with the values, each naming the key, the value and the fix; empty when valid.</summary>
    public IReadOnlyList<string> Validate() =>
        Period < TimeSpan.FromSeconds(1)
            ? [$"Health:Period {Period} must be at least 00:00:01 (the health checks' publishing period)."]
            : [];
}
