using System.Globalization;
using Spectre.Console;

namespace Monitor.Cli.Output;

/// <summary>Prints an <see cref="ExplainDocument"/>: the curves of both snapshots, then per book the four components and the factor terms.</summary>
internal static class ExplainTables
{
    public static void Write(IAnsiConsole console, ExplainDocument explain)
    {
        TableConsole.Line(console, $"holding period {explain.FromDate} -> {explain.ToDate}");
        CurveTables.WriteSummary(console, $"start curves ({explain.FromDate}, --from-quotes)", explain.FromCurves);
        CurveTables.WriteSummary(console, $"end curves ({explain.ToDate}, --to-quotes)", explain.ToCurves);
        foreach (var b in explain.Books)
        {
            var values = string.Create(CultureInfo.InvariantCulture,
                $"{b.Book}: V0 {Num.Money(b.V0)}, Vh {Num.Money(b.Vh)}, Vb {Num.Money(b.Vb)}, Vs {Num.Money(b.Vs)}, V1 {Num.Money(b.V1)} (cash received {Num.Money(b.ReceivedCash)})");
            TableConsole.Line(console, values);
            var components = TableConsole.Table(b.Book + ": holding-period return", "component (log return)", ">money", ">return (bp)");
            foreach (var c in b.Components)
            {
                TableConsole.Row(components, c.Name, Num.Money(c.Money), Num.Fixed(c.ReturnBp, 3));
            }
            TableConsole.Row(components, "total ln(V1/V0)", Num.Money(b.TotalPnl), Num.Fixed(b.TotalReturnBp, 3));
            TableConsole.Write(console, components);

            var terms = TableConsole.Table($"{b.Book}: curve returns at the horizon explained by factor terms (return = money / Vh)", "term", ">money", ">return (bp)");
            foreach (var curve in new[] { b.Base, b.Spread }.OfType<CurveExplainView>())
            {
                var moves = string.Join(", ", curve.FactorMovesBp.Select(m => $"{m.Key} {Num.Fixed(m.Value, 2)} bp"));
                var of = curve.FactorMovesOf is null ? string.Empty : " of " + curve.FactorMovesOf;
                TableConsole.Row(terms, curve.Actual.Name + " (moves" + of + ": " + moves + ")", Num.Money(curve.Actual.Money), Num.Fixed(curve.Actual.ReturnBp, 3));
                foreach (var t in curve.Terms.Append(curve.Shape).Append(curve.Residual))
                {
                    TableConsole.Row(terms, "  " + t.Name, Num.Money(t.Money), Num.Fixed(t.ReturnBp, 3));
                }
            }
            TableConsole.Write(console, terms);
        }
    }
}
