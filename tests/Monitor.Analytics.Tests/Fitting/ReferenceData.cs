using System.Globalization;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>Readers for the published datasets copied into Data/ (see Data/README.md).</summary>
internal static class ReferenceData
{
    public sealed record GswRow(string Date, double[] Parameters, double[] ZeroPercent, double[] ParPercent);

    public sealed record TreasuryRow(string Date, (double Tenor, double? ParPercent)[] Points);

    /// <summary>Gurkaynak, Sack and Wright (2006), feds200628 extract: parameters (percent, years), zero_1..30y, par_1..30y.</summary>
    public static IReadOnlyList<GswRow> Gsw()
    {
        var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Data", "svensson-published-sample.csv"));
        var header = lines[0].Split(',');
        var rows = new List<GswRow>();
        foreach (var line in lines.Skip(1).Where(l => l.Length > 0))
        {
            var cells = line.Split(',');
            double Cell(string name) => double.Parse(cells[Array.IndexOf(header, name)], CultureInfo.InvariantCulture);
            var p = new[] { Cell("beta0"), Cell("beta1"), Cell("beta2"), Cell("beta3"), Cell("tau1"), Cell("tau2") };
            var zero = Enumerable.Range(1, 30).Select(n => Cell($"zero_{n}y")).ToArray();
            var par = Enumerable.Range(1, 30).Select(n => Cell($"par_{n}y")).ToArray();
            rows.Add(new GswRow(cells[0], p, zero, par));
        }
        return rows;
    }

    /// <summary>US Treasury daily par yield curve rates extract; tenor labels 1m..30y to years; blank cells are null.</summary>
    public static IReadOnlyList<TreasuryRow> Treasury()
    {
        var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Data", "par-yields-published-sample.csv"));
        var header = lines[0].Split(',');
        var tenors = header.Skip(1).Select(h => h.EndsWith('m')
            ? double.Parse(h[..^1], CultureInfo.InvariantCulture) / 12.0
            : double.Parse(h[..^1], CultureInfo.InvariantCulture)).ToArray();
        var rows = new List<TreasuryRow>();
        foreach (var line in lines.Skip(1).Where(l => l.Length > 0))
        {
            var cells = line.Split(',');
            var pts = new (double, double?)[tenors.Length];
            for (var i = 0; i < tenors.Length; i++)
            {
                var c = i + 1 < cells.Length ? cells[i + 1].Trim() : "";
                pts[i] = (tenors[i], c.Length == 0 ? null : double.Parse(c, CultureInfo.InvariantCulture));
            }
            rows.Add(new TreasuryRow(cells[0], pts));
        }
        return rows;
    }
}
