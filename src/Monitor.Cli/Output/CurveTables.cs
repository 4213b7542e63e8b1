using System.Globalization;
using Spectre.Console;

namespace Monitor.Cli.Output;

/// <summary>Prints a <see cref="CurveView"/>: parameters and fit report, the curve at standard tenors, residuals, exclusions.</summary>
internal static class CurveTables
{
    /// <summary>The full picture of one fit (the fit verb).</summary>
    public static void Write(IAnsiConsole console, CurveView curve)
    {
        var summary = TableConsole.Table($"{curve.Curve} curve ({curve.Model}, {curve.Kind})", "parameter", ">value", "fit report", ">value");
        var parameters = curve.Parameters.Select(p => (p.Key, p.Key.StartsWith("tau", StringComparison.Ordinal) ? Num.Fixed(p.Value, 4) + " y" : Num.Pct(p.Value) + " %")).ToList();
        var report = new List<(string, string)>
        {
            ("RMSE", Num.Fixed(curve.RmseBp, 3) + " bp"),
            ("max error", Num.Fixed(curve.MaxAbsErrorBp, 3) + " bp" + (curve.MaxAbsErrorId is null ? string.Empty : $" ({curve.MaxAbsErrorId})")),
            ("iterations", curve.Iterations.ToString(CultureInfo.InvariantCulture)),
            ("converged", curve.Converged ? "yes" : "no"),
            ("exit reason", curve.ExitReason),
            (curve.Curve == "par-yields" ? "points used" : "instruments used", curve.UsedCount.ToString(CultureInfo.InvariantCulture)),
            ("quality gate", Gate(curve.Gate)),
        };
        for (var i = 0; i < Math.Max(parameters.Count, report.Count); i++)
        {
            TableConsole.Row(summary,
                i < parameters.Count ? parameters[i].Item1 : string.Empty, i < parameters.Count ? parameters[i].Item2 : string.Empty,
                i < report.Count ? report[i].Item1 : string.Empty, i < report.Count ? report[i].Item2 : string.Empty);
        }
        TableConsole.Write(console, summary);
        foreach (var reason in curve.Gate.Reasons)
        {
            TableConsole.Line(console, "  gate: " + reason);
        }
        foreach (var note in curve.Notes)
        {
            TableConsole.Line(console, "  note: " + note);
        }

        var points = curve.Kind == "spread"
            ? TableConsole.Table("spread curve", "tenor", ">spread (bp)")
            : TableConsole.Table("zero curve", "tenor", ">years", ">zero (%, cont.)", ">par (%, s.a.)");
        foreach (var p in curve.Points)
        {
            if (curve.Kind == "spread")
            {
                TableConsole.Row(points, p.Tenor, Num.Fixed(p.SpreadBp ?? double.NaN, 2));
            }
            else
            {
                TableConsole.Row(points, p.Tenor, Num.Fixed(p.Years, 4), Num.Fixed(p.ZeroPct ?? double.NaN, 4), Num.Fixed(p.ParPct ?? double.NaN, 4));
            }
        }
        TableConsole.Write(console, points);

        if (curve.Residuals.All(r => r.Maturity is null))
        {
            var parTable = TableConsole.Table("residuals (published - model par, bp)", "tenor", ">published par (%)", ">residual (bp)", "used");
            foreach (var r in curve.Residuals)
            {
                TableConsole.Row(parTable, r.Id, r.YieldPct is { } y ? Num.Fixed(y, 3) : string.Empty,
                    double.IsFinite(r.ResidualBp) ? Num.Fixed(r.ResidualBp, 3) : string.Empty, ParUse(r));
            }
            TableConsole.Write(console, parTable);
            WriteExcluded(console, curve, "points left out");
            return;
        }
        var residuals = TableConsole.Table("residuals (market minus model, bp of yield; + = cheap)", "id", "maturity", ">clean", ">yield (%)", ">residual (bp)", "used");
        foreach (var r in curve.Residuals)
        {
            TableConsole.Row(residuals, r.Id, r.Maturity ?? string.Empty, r.CleanPrice is { } c ? Num.Fixed(c, 3) : string.Empty,
                r.YieldPct is { } y ? Num.Fixed(y, 4) : string.Empty, Num.Fixed(r.ResidualBp, 2), r.Used ? "yes" : "outlier");
        }
        TableConsole.Write(console, residuals);
        WriteExcluded(console, curve, "quotes left out");
    }

    private static string ParUse(ResidualView r) =>
        r.Used ? "yes" : r.YieldPct is null ? "left out: no published yield" : "left out: outlier";

    /// <summary>One line per curve: what a risk or explain run was computed on.</summary>
    public static void WriteSummary(IAnsiConsole console, string title, IReadOnlyList<CurveView> curves)
    {
        var table = TableConsole.Table(title, "curve", "model", "parameters", ">RMSE (bp)", ">max (bp)", ">used", "left out", "gate");
        foreach (var c in curves)
        {
            var parameters = string.Join(" ", c.Parameters.Select(p => p.Key + "=" + p.Value.ToString("G5", CultureInfo.InvariantCulture)));
            var excluded = string.Join(", ", c.Excluded.Select(e => $"{e.Id} ({e.Reason})"));
            TableConsole.Row(table, c.Curve, c.Model, parameters, Num.Fixed(c.RmseBp, 3), Num.Fixed(c.MaxAbsErrorBp, 3),
                c.UsedCount.ToString(CultureInfo.InvariantCulture), excluded, Gate(c.Gate));
        }
        TableConsole.Write(console, table);
        foreach (var c in curves)
        {
            foreach (var reason in c.Gate.Reasons)
            {
                TableConsole.Line(console, $"  {c.Curve} gate: {reason}");
            }
            foreach (var note in c.Notes)
            {
                TableConsole.Line(console, $"  {c.Curve} note: {note}");
            }
        }
    }

    private static void WriteExcluded(IAnsiConsole console, CurveView curve, string title)
    {
        if (curve.Excluded.Count == 0)
        {
            TableConsole.Line(console, title + ": none");
            return;
        }
        var table = TableConsole.Table(title, "id", "reason", "detail");
        foreach (var e in curve.Excluded)
        {
            TableConsole.Row(table, e.Id, e.Reason, e.Detail);
        }
        TableConsole.Write(console, table);
    }

    private static string Gate(GateView gate) =>
        (gate.Passed ? "PASSED" : "FAILED") + string.Create(CultureInfo.InvariantCulture,
            $" (rmse <= {gate.MaxRmseBp}, max <= {gate.MaxAbsErrorBp} bp, >= {gate.MinInstruments} used)");
}
