using System.Globalization;
using Spectre.Console;

namespace Monitor.Cli.Output;

/// <summary>Prints a <see cref="BondView"/>: the bond in one line, then one measure a row.</summary>
internal static class BondTables
{
    public static void Write(IAnsiConsole console, BondView b)
    {
        TableConsole.Line(console, string.Create(CultureInfo.InvariantCulture,
            $"{b.Id}: {b.CouponPct}% to {b.MaturityDate}, {b.Frequency} coupon(s) a year, {b.DayCount}, accruing from {b.IssueDate}; settlement {b.SettlementDate}"));
        var table = TableConsole.Table($"{b.Convention} convention, from the {b.From} (per 100 face)", "measure", ">value");
        TableConsole.Row(table, "yield (%, compounded at the coupon frequency)", Num.Fixed(b.YieldPct, 6));
        TableConsole.Row(table, "clean price", Num.Fixed(b.CleanPrice, 6));
        TableConsole.Row(table, "accrued interest", Num.Fixed(b.AccruedInterest, 6));
        TableConsole.Row(table, "dirty price", Num.Fixed(b.DirtyPrice, 6));
        TableConsole.Row(table, "Macaulay duration (years)", Num.Fixed(b.MacaulayDuration, 6));
        TableConsole.Row(table, "modified duration (years)", Num.Fixed(b.ModifiedDuration, 6));
        TableConsole.Row(table, "convexity (years^2)", Num.Fixed(b.Convexity, 4));
        TableConsole.Row(table, "DV01 = PV01 (dirty price gain for a 1 bp yield fall)", Num.Fixed(b.Dv01, 6));
        TableConsole.Write(console, table);
    }
}
