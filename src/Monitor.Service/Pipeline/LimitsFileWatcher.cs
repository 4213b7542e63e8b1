using System.Security.Cryptography;
using System.Text;
using Microsoft.Extensions.FileProviders;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Limits;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Reloads the limits file when it changes; an accepted reload is written to the exposure log with the file's SHA-256.
/// A file that cannot be read (permissions, a folder in its place, gone) or fails validation is refused: the last good
/// limits stay in force, a warning is logged and the <c>limits</c> health check turns Degraded with the reason until a
/// good file is accepted. A refused file never stops the service.
/// </summary>
public sealed partial class LimitsFileWatcher(RiskPipeline pipeline, LimitsFileStatus status, IOptions<MonitorOptions> options, ILogger<LimitsFileWatcher> logger)
    : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var path = Path.GetFullPath(options.Value.LimitsFile);
        using var provider = new PhysicalFileProvider(Path.GetDirectoryName(path)!) { UsePollingFileWatcher = true, UseActivePolling = true };
        var name = Path.GetFileName(path);
        while (!stoppingToken.IsCancellationRequested)
        {
            var changed = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
            using (provider.Watch(name).RegisterChangeCallback(_ => changed.TrySetResult(), null))
            using (stoppingToken.Register(() => changed.TrySetCanceled(stoppingToken)))
            {
                try
                {
                    await changed.Task.ConfigureAwait(false);
                }
                catch (OperationCanceledException)
                {
                    return;
                }
            }
            await ReloadAsync(path, stoppingToken).ConfigureAwait(false);
        }
    }

    private async Task ReloadAsync(string path, CancellationToken cancellationToken)
    {
        byte[] bytes;
        try
        {
            bytes = await File.ReadAllBytesAsync(path, cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            Refuse(path, $"cannot be read ({ex.Message}); make it a readable limits file again");
            return;
        }
        try
        {
            var configuration = LimitsFileParser.Parse(Encoding.UTF8.GetString(bytes).TrimStart('\uFEFF'));
            var sha256 = Convert.ToHexStringLower(SHA256.HashData(bytes));
            var result = await pipeline.ReloadLimitsAsync(configuration, path, sha256, cancellationToken).ConfigureAwait(false);
            status.Accepted();
            var warnings = result.Flags.ToList();
            if (result.LimitCount == 0 && warnings.Count == 0)
            {
                warnings.Add("the file lists no limits; no book, desk or firm is judged");
            }
            if (warnings.Count > 0)
            {
                LogReloadFlagged(path, result.Added.Count, result.Removed.Count, result.Modified.Count, sha256, string.Join("; ", warnings));
            }
            else
            {
                LogReloaded(path, result.Added.Count, result.Removed.Count, result.Modified.Count, sha256);
            }
        }
        catch (LimitConfigurationException ex)
        {
            Refuse(path, $"refused: {ex.Message}");
        }
    }

    private void Refuse(string path, string reason)
    {
        status.Refused($"limits file '{path}' {reason}; the last good limits stay in force");
        LogRefused(path, reason);
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Limits reloaded from {Path}: {Added} added, {Removed} removed, {Modified} modified (SHA-256 {Sha256})")]
    private partial void LogReloaded(string path, int added, int removed, int modified, string sha256);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Limits reloaded from {Path}: {Added} added, {Removed} removed, {Modified} modified (SHA-256 {Sha256}), flagged: {Flags}")]
    private partial void LogReloadFlagged(string path, int added, int removed, int modified, string sha256, string flags);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Limits file {Path} {Problem}; the last good limits stay in force (health check limits: Degraded)")]
    private partial void LogRefused(string path, string problem);
}
