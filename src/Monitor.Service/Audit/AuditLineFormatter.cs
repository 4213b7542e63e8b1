using Serilog.Events;
using Serilog.Formatting;

namespace Monitor.Service.Audit;

/// <summary>
/// Writes the pre-built exposure-log/2 line carried by the event, then a line feed ("\n" on every platform).
/// The line is built and MACed before it reaches Serilog, so the file holds exactly the MACed bytes.
/// </summary>
internal sealed class AuditLineFormatter : ITextFormatter
{
    public const string LineProperty = "ExposureLogLine";

    public void Format(LogEvent logEvent, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(logEvent);
        ArgumentNullException.ThrowIfNull(output);
        output.Write(ReadString(logEvent, LineProperty));
        output.Write('\n');
    }

    public static string ReadString(LogEvent logEvent, string property) =>
        logEvent.Properties.TryGetValue(property, out var value) && value is ScalarValue { Value: string text }
            ? text
            : throw new InvalidOperationException($"The exposure log event has no string property '{property}'.");
}
