using System.Globalization;
using Spectre.Console;

namespace Monitor.Cli.Output;

/// <summary>Prints a <see cref="CurveParameterView"/>: the parameters in one line, then the curve at each tenor.</summary>
internal static class CurveParameterTables
{
    public static void Write(IAnsiConsole console, CurveParameterView view)
    {
        var parameters = string.Join(" ", view.Parameters.Select(p => p.Key + "=" + p.Value.ToString("G", CultureInfo.InvariantCulture)));
        TableConsole.Line(console, $"{view.Model}: {parameters} (betas in percent, decays in years)");
        TableConsole.Line(console, "curve time: years from the curve's date, as the parameters define it");
        var table = TableConsole.Table("curve at tenors", "tenor", ">years", ">zero (%, cont.)", ">par (%, s.a.)", ">forward (%, inst.)");
        foreach (var p in view.Points)
        {
            TableConsole.Row(table, p.Tenor, Num.Fixed(p.Years, 4), Num.Fixed(p.ZeroPct, 4), Num.Fixed(p.ParPct, 4), Num.Fixed(p.ForwardPct, 4));
        }
        TableConsole.Write(console, table);
    }
}
