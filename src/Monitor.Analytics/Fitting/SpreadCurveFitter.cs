using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// Fits a spread curve s(m) over a fixed base curve to one spread group's instruments: discount factor
/// exp(-(z_base(t) + s(t)) t), s(m) = g0 + g1 S(m/tau_s) + g2 C(m/tau_s) (Nelson-Siegel; Svensson if the
/// options ask for it). The base discount factors are computed once per fit. The result's curve is s(m) alone;
/// the spread level g0 is bounded below by <see cref="CurveFitOptions.MinSpreadLevel"/> (may be negative).
/// Like <see cref="BondCurveFitter"/>, an instance caches the flattened cash flows between refits (base discount factors
/// are recomputed on every call, since the base curve moves). Not thread-safe: one instance per thread.
/// </summary>
public sealed class SpreadCurveFitter
{
    private readonly FitEngine _engine = new();
    private readonly CashFlowProblemCache _cache = new();

    public CurveFitResult Fit(
        IZeroCurve baseCurve,
        IReadOnlyList<FitInstrument> instruments,
        CurveFitOptions options,
        double[]? warmStart = null,
        IReadOnlyList<FitExclusion>? preExcluded = null)
    {
        ArgumentNullException.ThrowIfNull(baseCurve);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        var exclusions = new List<FitExclusion>();
        var problem = _cache.Get(options.Model, instruments, preExcluded, baseCurve.Discount, exclusions);
        return _engine.Run(problem, options, isSpread: true, warmStart, exclusions, [], nameof(instruments));
    }
}
