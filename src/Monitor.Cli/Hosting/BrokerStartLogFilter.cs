using Serilog.Core;
using Serilog.Events;

namespace Monitor.Cli.Hosting;

/// <summary>
/// Until the service has started, drops the log events of a failed broker connection (MassTransit's and the host's,
/// each with a stack of ~50 lines): <c>monitor run</c> reports the failure as one line on stderr
/// (<see cref="BrokerStartFailure"/>). Once started, a lost connection is logged in full: the service is running then.
/// </summary>
internal sealed class BrokerStartLogFilter : ILogEventFilter
{
    private volatile bool _started;

    /// <summary>Called when the host has started; from then on nothing is dropped.</summary>
    public void Started() => _started = true;

    public bool IsEnabled(LogEvent logEvent)
    {
        ArgumentNullException.ThrowIfNull(logEvent);
        if (_started)
        {
            return true;
        }
        if (logEvent.Exception is { } ex)
        {
            return !BrokerStartFailure.IsConnectionFailure(ex);
        }
        // MassTransit's "Failed to stop bus ... (Not Started)" after a start that never connected.
        return !logEvent.MessageTemplate.Text.StartsWith("Failed to stop bus", StringComparison.Ordinal);
    }
}
