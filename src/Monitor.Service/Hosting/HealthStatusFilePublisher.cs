using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace Monitor.Service.Hosting;

/// <summary>
/// Publishes each health report (run every <c>Health:Period</c> by the health checks' hosted publisher): logs every change
/// of the overall status with the entries that are not healthy, and writes the report to <c>Health:StatusFile</c> when set
/// (JSON: <c>status</c>, <c>checkedAt</c>, and per check <c>status</c> and <c>description</c>; written to a temporary file
/// and renamed, so a reader never sees half a report). The service has no HTTP endpoint; this file is its health probe.
/// </summary>
public sealed partial class HealthStatusFilePublisher(IOptions<HealthOptions> options, TimeProvider time, ILogger<HealthStatusFilePublisher> logger) : IHealthCheckPublisher
{
    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };
    private HealthStatus? _lastStatus;
    private bool _fileFailing;

    public Task PublishAsync(HealthReport report, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(report);
        if (_lastStatus != report.Status)
        {
            var problems = string.Join("; ", report.Entries.Where(e => e.Value.Status != HealthStatus.Healthy).Select(e => $"{e.Key}: {e.Value.Description}"));
            if (report.Status == HealthStatus.Healthy)
            {
                LogHealthy(_lastStatus?.ToString() ?? "start");
            }
            else
            {
                LogNotHealthy(report.Status, problems);
            }
            _lastStatus = report.Status;
        }
        var file = options.Value.StatusFile;
        if (!string.IsNullOrWhiteSpace(file))
        {
            Write(file, report);
        }
        return Task.CompletedTask;
    }

    private void Write(string file, HealthReport report)
    {
        var entries = new JsonObject();
        foreach (var (name, entry) in report.Entries.OrderBy(e => e.Key, StringComparer.Ordinal))
        {
            entries[name] = new JsonObject { ["status"] = entry.Status.ToString(), ["description"] = entry.Description };
        }
        var document = new JsonObject
        {
            ["status"] = report.Status.ToString(),
            ["checkedAt"] = time.GetUtcNow().ToString("O", CultureInfo.InvariantCulture),
            ["entries"] = entries,
        };
        var temporary = file + ".tmp";
        try
        {
            // A missing folder (var/ on a fresh clone) is created.
            Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(file))!);
            File.WriteAllText(temporary, document.ToJsonString(Indented));
            File.Move(temporary, file, overwrite: true);
            _fileFailing = false;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            if (!_fileFailing)
            {
                LogFileFailed(file, ex.Message);
            }
            _fileFailing = true;
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Health: Healthy (was {Previous})")]
    private partial void LogHealthy(string previous);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Health: {Status}: {Problems}")]
    private partial void LogNotHealthy(HealthStatus status, string problems);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Health status file '{File}' cannot be written: {Reason}")]
    private partial void LogFileFailed(string file, string reason);
}
