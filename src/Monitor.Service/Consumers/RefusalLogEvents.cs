using Monitor.Service.Messaging;
using Serilog.Core;
using Serilog.Events;

namespace Monitor.Service.Consumers;

/// <summary>
/// Keeps a refused message to the one Warning line of <see cref="RefusalFilter"/>: MassTransit logs every consumer fault
/// itself, at Error with the exception's stack, and a <see cref="MessageRejectedException"/> is not a fault of the
/// service. Add to every Serilog pipeline of the service (<c>logger.Filter.With(new RefusalLogEvents())</c>).
/// </summary>
public sealed class RefusalLogEvents : ILogEventFilter
{
    /// <summary>The log category of the refusal lines.</summary>
    public const string Category = "Monitor.Service.Refusals";

    public bool IsEnabled(LogEvent logEvent)
    {
        ArgumentNullException.ThrowIfNull(logEvent);
        return !IsMassTransitRefusal(logEvent);
    }

    /// <summary>True for a MassTransit event whose exception is (or wraps) a refusal.</summary>
    public static bool IsMassTransitRefusal(LogEvent logEvent)
    {
        ArgumentNullException.ThrowIfNull(logEvent);
        if (logEvent.Exception is null
            || !(logEvent.Properties.TryGetValue("SourceContext", out var source) && source is ScalarValue { Value: string name }
                && name.StartsWith("MassTransit", StringComparison.Ordinal)))
        {
            return false;
        }
        for (var ex = logEvent.Exception; ex is not null; ex = ex.InnerException)
        {
            if (ex is MessageRejectedException)
            {
                return true;
            }
        }
        return false;
    }
}
