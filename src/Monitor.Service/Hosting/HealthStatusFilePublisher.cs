using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace Monitor.Service.Hosting;

/// <summary>
/// Publishes each health report (run every <c>Health:Period</c> by the health checks' hosted publisher): logs every change
/// of the overall status with the entries that are not healthy, and writes the report to <c>Health:StatusFile</c> when set
/// (JSON: <c>status</c>, <c>checkedAt</c>, <c>writtenAt</c>, and per check <c>status</c> and <c>description</c>; written to
/// a temporary file and renamed, so a reader never sees half a report; a missing folder is created). As a hosted service
/// that stops last, it writes <c>"status": "Stopped"</c> when the service stops (cleanly or after a fault), so the file
/// never reports a stopped service as healthy; reports that arrive after that are not written. The service has no HTTP
/// endpoint; this file is its health probe.
/// </summary>
public sealed partial class HealthStatusFilePublisher(IOptions<HealthOptions> options, TimeProvider time, ILogger<HealthStatusFilePublisher> logger)
    : IHealthCheckPublisher, IHostedService
{
    /// <summary>Our overall status once the service has stopped (the health checks' own statuses stop at Unhealthy).</summary>
    public const string Stopped = "Stopped";

    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };
    private readonly Lock _write = new();
    private HealthStatus? _lastStatus;
    private bool _fileFailing;
    private bool _stopped;

    public Task PublishAsync(HealthReport report, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(report);
        lock (_write)
        {
            if (_stopped)
            {
                return Task.CompletedTask;
            }
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
            var entries = new JsonObject();
            foreach (var (name, entry) in report.Entries.OrderBy(e => e.Key, StringComparer.Ordinal))
            {
                entries[name] = new JsonObject { ["status"] = entry.Status.ToString(), ["description"] = entry.Description };
            }
            var now = Now();
            Write(new JsonObject { ["status"] = report.Status.ToString(), ["checkedAt"] = now, ["writtenAt"] = now, ["entries"] = entries });
        }
        return Task.CompletedTask;
    }

    public Task StartAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    /// <summary>Writes the Stopped report; later reports are ignored.</summary>
    public Task StopAsync(CancellationToken cancellationToken)
    {
        lock (_write)
        {
            if (!_stopped)
            {
                _stopped = true;
                LogStopped();
                Write(new JsonObject { ["status"] = Stopped, ["writtenAt"] = Now(), ["entries"] = new JsonObject() });
            }
        }
        return Task.CompletedTask;
    }

    private string Now() => time.GetUtcNow().ToString("O", CultureInfo.InvariantCulture);

    private void Write(JsonObject document)
    {
        var file = options.Value.StatusFile;
        if (string.IsNullOrWhiteSpace(file))
        {
            return;
        }
        var temporary = file + ".tmp";
        try
        {
            if (Path.GetDirectoryName(Path.GetFullPath(file)) is { Length: > 0 } folder)
            {
                Directory.CreateDirectory(folder);
            }
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

    [LoggerMessage(Level = LogLevel.Information, Message = "Health: Stopped (the service is stopping)")]
    private partial void LogStopped();

    [LoggerMessage(Level = LogLevel.Information, Message = "Health: Healthy (was {Previous})")]
    private partial void LogHealthy(string previous);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Health: {Status}: {Problems}")]
    private partial void LogNotHealthy(HealthStatus status, string problems);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Health status file '{File}' cannot be written: {Reason}")]
    private partial void LogFileFailed(string file, string reason);
}
