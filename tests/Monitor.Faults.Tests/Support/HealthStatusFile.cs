using System.Text.Json.Nodes;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// Reads the health report the service writes to <c>Health:StatusFile</c> (Hosting/HealthStatusFilePublisher.cs): the overall
/// status and, per health check, its status and description.
/// </summary>
public sealed class HealthStatusFile(string path)
{
    public string Path { get; } = path;

    /// <summary>The environment that makes the service write its report here every second.</summary>
    public IReadOnlyDictionary<string, string> ServiceEnvironment => new Dictionary<string, string>
    {
        ["Health__StatusFile"] = Path,
        ["Health__Period"] = "00:00:01",
    };

    /// <summary>(status, description) of one health check, or null while there is no report yet.</summary>
    public (string Status, string Description)? Entry(string check)
    {
        if (!File.Exists(Path))
        {
            return null;
        }
        var entry = JsonNode.Parse(File.ReadAllText(Path))?["entries"]?[check];
        return entry is null ? null : ((string?)entry["status"] ?? "", (string?)entry["description"] ?? "");
    }

    /// <summary>Waits until the check reports <paramref name="status"/>; returns its description.</summary>
    public async Task<string> WaitForAsync(string check, string status, ServiceProcess service, TimeSpan timeout)
    {
        var clock = System.Diagnostics.Stopwatch.StartNew();
        (string Status, string Description)? last = null;
        while (clock.Elapsed < timeout)
        {
            if (service.HasExited)
            {
                throw new InvalidOperationException($"the service exited while waiting for health '{check}' = {status}. Output:\n{service.Tail()}");
            }
            last = Entry(check);
            if (last?.Status == status)
            {
                return last.Value.Description;
            }
            await Task.Delay(250);
        }
        throw new TimeoutException($"health '{check}' was not {status} within {timeout} (last: {last}). Output:\n{service.Tail()}");
    }
}
