using System.Diagnostics;
using System.Text;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// One `dotnet monitor.dll run --config FILE` process (the monitor executable built next to the tests), with its
/// console output captured. Dispose kills it (and its children) if it is still running.
/// </summary>
public sealed class ServiceProcess : IDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _output = new();
    private readonly object _sync = new();

    private ServiceProcess(Process process)
    {
        _process = process;
    }

    public int Id => _process.Id;

    public bool HasExited => _process.HasExited;

    /// <summary>Everything the process wrote to stdout and stderr so far.</summary>
    public string Output
    {
        get
        {
            lock (_sync)
            {
                return _output.ToString();
            }
        }
    }

    /// <summary>
    /// Starts the service with broker credentials in the environment (never in the configuration file); <paramref name="environment"/>
    /// adds variables, e.g. configuration overrides such as <c>Health__StatusFile</c>.
    /// </summary>
    public static ServiceProcess Start(string configFile, string workingFolder, string brokerUser, string brokerPassword, IReadOnlyDictionary<string, string>? environment = null)
    {
        var monitorDll = Path.Combine(AppContext.BaseDirectory, "monitor.dll");
        if (!File.Exists(monitorDll))
        {
            throw new FileNotFoundException($"monitor.dll is not beside the tests in '{AppContext.BaseDirectory}'; the project must reference src/Monitor.Cli.", monitorDll);
        }
        var info = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = workingFolder,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(monitorDll);
        info.ArgumentList.Add("run");
        info.ArgumentList.Add("--config");
        info.ArgumentList.Add(configFile);
        info.Environment["MONITOR_BROKER_USER"] = brokerUser;
        info.Environment["MONITOR_BROKER_PASSWORD"] = brokerPassword;
        info.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        foreach (var (name, value) in environment ?? new Dictionary<string, string>())
        {
            info.Environment[name] = value;
        }
        var process = new Process { StartInfo = info };
        var service = new ServiceProcess(process);
        process.OutputDataReceived += (_, e) => service.Append(e.Data);
        process.ErrorDataReceived += (_, e) => service.Append(e.Data);
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return service;
    }

    /// <summary>SIGKILL to the process tree: no chance to flush, close or acknowledge anything.</summary>
    public void KillHard()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
        }
        _process.WaitForExit(10_000);
    }

    /// <summary>
    /// SIGTERM (a service manager's stop): the host stops cleanly and writes the stop record (stop-snapshot per book, then service-stopped). Returns the exit code.
    /// Not SIGINT: a shell starts background jobs with SIGINT ignored and the child processes inherit that, so a test
    /// run started with `&amp;` (or from a CI runner doing so) would never see the service stop.
    /// </summary>
    public async Task<int> InterruptAsync(TimeSpan timeout)
    {
        using (var kill = Process.Start(new ProcessStartInfo("kill", ["-TERM", _process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)]) { UseShellExecute = false })!)
        {
            await kill.WaitForExitAsync();
        }
        using var cts = new CancellationTokenSource(timeout);
        try
        {
            await _process.WaitForExitAsync(cts.Token);
        }
        catch (OperationCanceledException)
        {
            throw new TimeoutException($"the service (pid {_process.Id}) did not stop within {timeout} of SIGTERM. Output:\n{Tail()}");
        }
        return _process.ExitCode;
    }

    /// <summary>The last lines of the output, for failure messages.</summary>
    public string Tail(int lines = 40) => string.Join('\n', Output.Split('\n').TakeLast(lines));

    public void Dispose()
    {
        try
        {
            if (!_process.HasExited)
            {
                _process.Kill(entireProcessTree: true);
                _process.WaitForExit(10_000);
            }
        }
        catch (InvalidOperationException)
        {
        }
        _process.Dispose();
    }

    private void Append(string? line)
    {
        if (line is null)
        {
            return;
        }
        lock (_sync)
        {
            _output.AppendLine(line);
        }
    }
}
