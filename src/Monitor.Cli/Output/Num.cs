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

    private static string F(double x, string format) => double.IsFinite(x) ? x.ToString(format, CultureInfo.InvariantCulture) : "n/a";
}
