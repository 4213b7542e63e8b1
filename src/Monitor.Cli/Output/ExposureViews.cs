using Monitor.Analytics.Risk;

namespace Monitor.Cli.Output;

/// <summary>Builds <see cref="ExposureView"/>s and compares two of them.</summary>
internal static class ExposureViews
{
    /// <summary>Money convexity d2V/db0^2 in money per bp squared: times (1e-4)^2, as the service's limit measure.</summary>
    private const double BasisPointSquared = 1e-8;

    /// <param name="e">Exposures.</param>
    /// <param name="baseNames">Base curve factor names.</param>
    /// <param name="spreadNames">Spread curve factor names (figures beyond the exposure's spread factors are 0).</param>
    public static ExposureView Of(FactorExposures e, IReadOnlyList<string> baseNames, IReadOnlyList<string> spreadNames) =>
        new(
            e.Value,
            e.Dv01,
            ByName(baseNames, e.BaseMoneyPerBp),
            ByName(baseNames, e.BaseDuration),
            ByName(spreadNames, e.SpreadMoneyPerBp),
            ByName(spreadNames, e.SpreadDuration),
            e.BaseConvexity(0),
            e.BaseMoneyConvexity(0, 0) * BasisPointSquared);

    /// <summary>Largest absolute difference over the money figures (value, DV01, money per bp, money convexity).</summary>
    public static double MaxAbsDifference(ExposureView a, ExposureView b)
    {
        var diffs = new List<double>
        {
            Math.Abs(a.Value - b.Value),
            Math.Abs(a.Dv01 - b.Dv01),
            Math.Abs(a.LevelMoneyConvexity - b.LevelMoneyConvexity),
        };
        diffs.AddRange(a.BaseMoneyPerBp.Select(p => Math.Abs(p.Value - b.BaseMoneyPerBp[p.Key])));
        diffs.AddRange(a.SpreadMoneyPerBp.Select(p => Math.Abs(p.Value - b.SpreadMoneyPerBp[p.Key])));
        return diffs.Max();
    }

    private static Dictionary<string, double> ByName(IReadOnlyList<string> names, Func<int, double> figure)
    {
        var result = new Dictionary<string, double>(StringComparer.Ordinal);
        for (var k = 0; k < names.Count; k++)
        {
            result[names[k]] = figure(k);
        }
        return result;
    }
}
