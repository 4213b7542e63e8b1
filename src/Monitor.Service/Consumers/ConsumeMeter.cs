using System.Diagnostics.Metrics;
using Monitor.Service.Messaging;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Consumers;

/// <summary>Counts each consumed message by type, and each refused one (a <see cref="MessageRejectedException"/>) by type and field.</summary>
public static class ConsumeMeter
{
    public static async Task RunAsync(MonitorMetrics metrics, string messageType, Func<Task> consume)
    {
        ArgumentNullException.ThrowIfNull(metrics);
        ArgumentNullException.ThrowIfNull(consume);
        var type = new KeyValuePair<string, object?>("type", messageType);
        metrics.MessagesConsumed.Add(1, type);
        try
        {
            await consume().ConfigureAwait(false);
        }
        catch (MessageRejectedException ex)
        {
            metrics.MessagesRejected.Add(1, type, new KeyValuePair<string, object?>("field", ex.Field));
            throw;
        }
    }
}
