namespace Monitor.Analytics.Fitting;

/// <summary>
/// Fits a Nelson-Siegel or Svensson base curve to instrument prices: minimises sum_i ((P_model,i - P_i) / (P_i D_i))^2,
/// price errors weighted so residuals read as yield errors (bp = 1e4 x decimal). Levenberg-Marquardt with the
/// analytic Jacobian; cold start by a decay grid, warm start from previous parameters; outliers dropped and
/// recorded. Guard rails: decays in [MinTau, MaxTau], b0 &gt;= MinLevel &gt; 0, |b_k| &lt;= MaxAbsBeta.
/// An instance keeps its solver workspace and the flattened cash flows between fits: a refit with the same instruments
/// (same ids, order and Times/Amounts arrays; new prices) only re-reads prices and durations. Do not change a Times or
/// Amounts array in place after passing it. Not thread-safe: use one instance per thread.
/// </summary>
public sealed class BondCurveFitter
{
    private readonly FitEngine _engine = new();
    private readonly CashFlowProblemCache _cache = new();

    /// <param name="instruments">Quoted instruments with cash flows (curve years, per 100) and dirty prices.</param>
    /// <param name="options">Model, solver, bounds, outlier settings.</param>
    /// <param name="warmStart">Previous parameters in the model's ToArray order, or null for a cold start.</param>
    /// <param name="preExcluded">Instruments the caller already excluded (for example stale quotes); skipped and reported.</param>
    public CurveFitResult Fit(
        IReadOnlyList<FitInstrument> instruments,
        CurveFitOptions options,
        double[]? warmStart = null,
        IReadOnlyList<FitExclusion>? preExcluded = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        var exclusions = new List<FitExclusion>();
        var problem = _cache.Get(options.Model, instruments, preExcluded, null, exclusions);
        return _engine.Run(problem, options, isSpread: false, warmStart, exclusions, [], nameof(instruments));
    }
}
