using System.Globalization;

namespace Monitor.Cli.Output;

/// <summary>Invariant number formats for tables; a non-finite number prints as "n/a".</summary>
internal static class Num
{
    /// <summary>Money, thousands separated, no decimals.</summary>
    public static string Money(double x) => F(x, "N0");

    /// <summary>Money per bp, thousands separated, 2 decimals.</summary>
    public static string PerBp(double x) => F(x, "N2");

    public static string Fixed(double x, int decimals) => F(x, "F" + decimals.ToString(CultureInfo.InvariantCulture));

    /// <summary>A decimal rate as percent with 4 decimals.</summary>
    public static string Pct(double x) => F(100 * x, "F4");

    public static string Date(DateOnly d) => d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    // A value that rounds to zero prints without a sign ("-0.00" reads as a short position).
    private static string F(double x, string format)
    {
        if (!double.IsFinite(x))
        {
            return "n/a";
        }
        var text = x.ToString(format, CultureInfo.InvariantCulture);
        return text.StartsWith('-') && text.All(c => c is '-' or '0' or '.' or ',') ? text[1..] : text;
    }
}
