using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// Fits a spread curve s(m) over a fixed base curve to one spread group's instruments: discount factor
/// exp(-(z_base(t) + s(t)) t), s(m) = g0 + g1 S(m/tau_s) + g2 C(m/tau_s) (Nelson-Siegel; Svensson if the
/// options ask for it). The base discount factors are computed once per fit. The result's curve is s(m) alone;
/// the spread level g0 is bounded below by <see cref="CurveFitOptions.MinSpreadLevel"/> (may be negative).
/// Not thread-safe: one instance per thread.
/// </summary>
public sealed class SpreadCurveFitter
{
    private readonly FitEngine _engine = new();

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
        var valid = InstrumentValidation.Prepare(instruments, preExcluded, exclusions);
        var problem = new CashFlowProblem(options.Model, valid, baseCurve.Discount);
        return _engine.Run(problem, options, isSpread: true, warmStart, exclusions, [], nameof(instruments));
    }
}
