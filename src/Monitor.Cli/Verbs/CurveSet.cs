using Monitor.Analytics.Curves;

namespace Monitor.Cli.Verbs;

/// <summary>The government curve and the spread curves of one market snapshot, all measured from <see cref="ValuationDate"/>.</summary>
internal sealed record CurveSet(DateOnly ValuationDate, FittedCurve Government, IReadOnlyDictionary<string, FittedCurve> Spreads)
{
    public IFactorCurve Base => Government.Result.Curve;

    public Dictionary<string, IFactorCurve> SpreadCurves() =>
        Spreads.ToDictionary(p => p.Key, p => p.Value.Result.Curve, StringComparer.Ordinal);

    /// <summary>Government first, then spread groups in name order.</summary>
    public IEnumerable<FittedCurve> All() =>
        new[] { Government }.Concat(Spreads.OrderBy(p => p.Key, StringComparer.Ordinal).Select(p => p.Value));
}
