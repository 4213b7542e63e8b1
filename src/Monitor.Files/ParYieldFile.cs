using Monitor.Analytics.Fitting;
using Monitor.Analytics.Market;
using Monitor.Files.Csv;

namespace Monitor.Files;

/// <summary>
/// Par-yield points file (our format): <c>as_of,tenor,par_yield_pct</c>, tenor as 1M..30Y,
/// par yields bond-equivalent in percent. A blank yield means "not published": the point is kept with no yield and the fit leaves it out.
/// </summary>
public static class ParYieldFile
{
    private static readonly string[] Required = ["as_of", "tenor", "par_yield_pct"];

    public static IReadOnlyList<ParYieldSet> Read(TextReader reader, string fileName)
    {
        var byDate = new SortedDictionary<DateOnly, List<ParYieldPoint>>();
        foreach (var row in CsvTable.Read(reader, fileName, Required, []))
        {
            var asOf = row.RequiredDate("as_of");
            var tenorText = row.RequiredText("tenor");
            if (!Tenor.TryParseYears(tenorText, out var years))
            {
                throw row.Error("tenor", tenorText, "is not a tenor: use a count and M or Y, e.g. 3M, 2Y.");
            }
            var pct = row.OptionalNumber("par_yield_pct");
            if (pct < -20 || pct > 100)
            {
                throw row.Error("par_yield_pct", row.Raw("par_yield_pct"), "is outside -20..100 percent.");
            }
            if (!byDate.TryGetValue(asOf, out var points))
            {
                byDate[asOf] = points = [];
            }
            points.Add(new ParYieldPoint(years, pct / 100.0));
        }
        return byDate.Select(p => new ParYieldSet(p.Key, p.Value.OrderBy(x => x.TenorYears).ToArray())).ToArray();
    }

    public static IReadOnlyList<ParYieldSet> Read(string path) => FileReading.Read(path, Read);
}
