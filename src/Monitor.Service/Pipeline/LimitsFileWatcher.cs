using Microsoft.Extensions.FileProviders;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Primitives;
using Monitor.Limits;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Reloads the limits file when it changes. A file that fails validation is refused with its errors logged,
/// and the limits in force stay; an accepted reload is written to the exposure log.
/// </summary>
public sealed partial class LimitsFileWatcher(RiskPipeline pipeline, IOptions<MonitorOptions> options, ILogger<LimitsFileWatcher> logger)
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
        try
        {
            var configuration = LimitsFileParser.Parse(await File.ReadAllTextAsync(path, cancellationToken).ConfigureAwait(false));
            var result = await pipeline.ReloadLimitsAsync(configuration, path, cancellationToken).ConfigureAwait(false);
            LogReloaded(path, result.Added.Count, result.Removed.Count, result.Modified.Count);
        }
        catch (Exception ex) when (ex is LimitConfigurationException or IOException)
        {
            LogRefused(path, ex.Message);
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Limits reloaded from {Path}: {Added} added, {Removed} removed, {Modified} modified")]
    private partial void LogReloaded(string path, int added, int removed, int modified);

    [LoggerMessage(Level = LogLevel.Error, Message = "Limits file {Path} refused, the limits in force stay: {Problem}")]
    private partial void LogRefused(string path, string problem);
}
