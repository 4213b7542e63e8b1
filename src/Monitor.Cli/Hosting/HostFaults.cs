using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;

namespace Monitor.Cli.Hosting;

/// <summary>
/// The faults that stopped a host. On .NET 10 a <see cref="BackgroundService"/> whose <c>ExecuteAsync</c> throws stops
/// the host (<see cref="BackgroundServiceExceptionBehavior.StopHost"/>, the default) but <c>RunAsync</c> still completes
/// normally (it throws only from .NET 11 on), so the process would exit 0 after a fault unless the caller looks here.
/// </summary>
internal static class HostFaults
{
    /// <summary>Each background service that ended with an exception: its type name and the exception.</summary>
    public static IReadOnlyList<(string Service, Exception Fault)> Of(IServiceProvider services) =>
        services.GetServices<IHostedService>()
            .OfType<BackgroundService>()
            .Where(s => s.ExecuteTask is { IsFaulted: true })
            .Select(s => (s.GetType().Name, (Exception)s.ExecuteTask!.Exception!.GetBaseException()))
            .ToArray();
}
