using System.Globalization;
using Spectre.Console;

namespace Monitor.Cli.Output;

/// <summary>Prints a <see cref="RiskDocument"/>: curves used, positions (money per bp, then unit durations) and books.</summary>
internal static class RiskTables
{
    public static void Write(IAnsiConsole console, RiskDocument risk)
    {
        TableConsole.Line(console, "valuation date " + risk.ValuationDate);
        CurveTables.WriteSummary(console, "curves", risk.Curves);
        var sample = risk.Books.FirstOrDefault()?.Exposures;
        if (sample is null)
        {
            TableConsole.Line(console, "no positions");
            return;
        }
        var baseNames = sample.BaseMoneyPerBp.Keys.ToArray();
        var spreadNames = sample.SpreadMoneyPerBp.Keys.ToArray();
        if (risk.Positions is { } positions)
        {
            var money = TableConsole.Table("positions: money per bp (money lost when the factor rises 1 bp; + = long)",
                [.. new[] { "book", "instrument", ">face", ">value", ">DV01" }, .. MoneyColumns(baseNames, spreadNames)]);
            var units = TableConsole.Table("positions: unit durations (years) and level convexity (years^2)",
                [.. new[] { "book", "instrument" }, .. UnitColumns(baseNames, spreadNames)]);
            foreach (var p in positions)
            {
                TableConsole.Row(money, [p.Book, p.InstrumentId, Num.Money(p.FaceAmount), Num.Money(p.Exposures.Value), Num.PerBp(p.Exposures.Dv01), .. MoneyCells(p.Exposures)]);
                TableConsole.Row(units, [p.Book, p.InstrumentId, .. UnitCells(p.Exposures)]);
            }
            TableConsole.Write(console, money);
            TableConsole.Write(console, units);
        }
        var books = TableConsole.Table("books: from cash flows merged by date (money per bp); last column: largest gap to the sum of the positions",
            [.. new[] { "book", ">positions", ">value", ">DV01" }, .. MoneyColumns(baseNames, spreadNames), ">|book - sum|"]);
        var bookUnits = TableConsole.Table("books: unit durations (years) and level convexity (years^2)",
            [.. new[] { "book" }, .. UnitColumns(baseNames, spreadNames)]);
        foreach (var b in risk.Books)
        {
            TableConsole.Row(books, [b.Book, b.Positions.ToString(CultureInfo.InvariantCulture), Num.Money(b.Exposures.Value), Num.PerBp(b.Exposures.Dv01),
                .. MoneyCells(b.Exposures), b.MaxAbsDifference.ToString("0.0E+0", CultureInfo.InvariantCulture)]);
            TableConsole.Row(bookUnits, [b.Book, .. UnitCells(b.Exposures)]);
        }
        TableConsole.Write(console, books);
        TableConsole.Write(console, bookUnits);
    }

    private static IEnumerable<string> MoneyColumns(string[] baseNames, string[] spreadNames) =>
        [.. baseNames.Select(n => ">base " + n), .. spreadNames.Select(n => ">spread " + n), ">level conv (/bp^2)"];

    private static IEnumerable<string> UnitColumns(string[] baseNames, string[] spreadNames) =>
        [.. baseNames.Select(n => ">D base " + n), .. spreadNames.Select(n => ">D spread " + n), ">C level"];

    private static IEnumerable<string> MoneyCells(ExposureView e) =>
        [.. e.BaseMoneyPerBp.Values.Select(Num.PerBp), .. e.SpreadMoneyPerBp.Values.Select(Num.PerBp), Num.PerBp(e.LevelMoneyConvexity)];

    private static IEnumerable<string> UnitCells(ExposureView e) =>
        [.. e.BaseDuration.Values.Select(x => Num.Fixed(x, 4)), .. e.SpreadDuration.Values.Select(x => Num.Fixed(x, 4)), Num.Fixed(e.LevelConvexity, 3)];
}
