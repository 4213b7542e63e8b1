using System.Globalization;

namespace Monitor.Cli.Demo;

/// <summary>Number and time formats of the demo's output (invariant culture).</summary>
internal static class DemoFormat
{
    private static readonly CultureInfo Invariant = CultureInfo.InvariantCulture;

    /// <summary>Whole money amount with thousands separators, e.g. 1,234,567; "-" before a book is valued.</summary>
    public static string Money(double value) => double.IsFinite(value) ? value.ToString("N0", Invariant) : "-";

    /// <summary>Money in millions with two decimals, e.g. 78.12m.</summary>
    public static string Millions(double value) => double.IsFinite(value) ? (value / 1e6).ToString("N2", Invariant) + "m" : "-";

    /// <summary>A fraction as a percentage with one decimal, e.g. 0.853 -> 85.3%.</summary>
    public static string Percent(double fraction) => (fraction * 100).ToString("F1", Invariant) + "%";

    public static string Number(double value, string format) => value.ToString(format, Invariant);

    public static string Clock(DateTimeOffset time) => time.ToString("HH:mm:ss", Invariant);

    public static string Duration(TimeSpan span) => span.ToString(@"h\:mm", Invariant);

    /// <summary>One line for a status change: time, kind, limit, exposure against the bound, use, previous status, the cause in words.</summary>
    public static string StatusLine(ObservedStatusChange change)
    {
        ArgumentNullException.ThrowIfNull(change);
        var m = change.Message;
        var kind = change.Kind switch
        {
            StatusChangeKind.Breach => "BREACH ",
            StatusChangeKind.Warning => "WARNING",
            _ => "CLEAR  ",
        };
        return string.Create(Invariant,
            $"{Clock(m.EventTime)}  {kind}  {m.LimitId} ({m.Scope} {m.ScopeId}, {m.Measure}): {Money(m.Exposure)} of {Money(m.Limit)} = {Percent(m.Utilisation)}, {m.PreviousStatus} -> {m.Status}, {change.Cause}");
    }
}
