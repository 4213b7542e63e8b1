using System.Diagnostics;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// Drives the local RabbitMQ node through `rabbitmqctl` (same machine, loopback): a throw-away virtual host per
/// test so that the fixed queue names do not meet other tests' messages, and stop_app/start_app to cut the broker.
/// </summary>
public static class BrokerAdmin
{
    public const string User = "guest";
    public const string Password = "guest";

    public static async Task CreateVirtualHostAsync(string vhost)
    {
        await CtlAsync(TimeSpan.FromSeconds(30), "add_vhost", vhost);
        await CtlAsync(TimeSpan.FromSeconds(30), "set_permissions", "-p", vhost, User, ".*", ".*", ".*");
    }

    public static async Task DeleteVirtualHostAsync(string vhost)
    {
        try
        {
            await CtlAsync(TimeSpan.FromSeconds(30), "delete_vhost", vhost);
        }
        catch (InvalidOperationException)
        {
            // Best effort: a leftover vhost costs nothing but a name.
        }
    }

    /// <summary>Stops the RabbitMQ application on the node (the Erlang VM stays up): every connection drops.</summary>
    public static Task StopAppAsync() => CtlAsync(TimeSpan.FromSeconds(60), "stop_app");

    public static async Task StartAppAsync()
    {
        await CtlAsync(TimeSpan.FromSeconds(60), "start_app");
        await CtlAsync(TimeSpan.FromSeconds(60), "await_startup");
    }

    private static async Task CtlAsync(TimeSpan timeout, params string[] arguments)
    {
        var info = new ProcessStartInfo("rabbitmqctl") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var argument in arguments)
        {
            info.ArgumentList.Add(argument);
        }
        using var process = Process.Start(info)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        using var cts = new CancellationTokenSource(timeout);
        try
        {
            await process.WaitForExitAsync(cts.Token);
        }
        catch (OperationCanceledException)
        {
            process.Kill(entireProcessTree: true);
            throw new InvalidOperationException($"rabbitmqctl {string.Join(' ', arguments)} did not finish within {timeout}.");
        }
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"rabbitmqctl {string.Join(' ', arguments)} failed ({process.ExitCode}): {await stdout} {await stderr}");
        }
    }
}
