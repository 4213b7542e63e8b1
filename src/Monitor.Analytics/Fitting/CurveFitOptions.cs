namespace Monitor.Analytics.Fitting;

/// <summary>
/// Settings of a curve fit. Decays (tau) in years; error thresholds in basis points of yield.
/// Defaults are common practice, no source: decays within [0.05, 30] years keep the loadings
/// distinguishable over a 1M..30Y curve; level (b0) at least 1e-6 (the guard rail b0 &gt; 0).
/// </summary>
public sealed record CurveFitOptions
{
    public CurveModel Model { get; init; } = CurveModel.NelsonSiegel;

    public FitSolver Solver { get; init; } = FitSolver.Native;

    /// <summary>Smallest decay allowed (years).</summary>
    public double MinTau { get; init; } = 0.05;

    /// <summary>Largest decay allowed (years); at most <c>100</c>, the curve classes' limit.</summary>
    public double MaxTau { get; init; } = 30.0;

    /// <summary>Lower bound of the level b0 of a base curve (decimal). Spread fits use <see cref="MinSpreadLevel"/>.</summary>
    public double MinLevel { get; init; } = 1e-6;

    /// <summary>Lower bound of the level g0 of a spread curve (decimal).</summary>
    public double MinSpreadLevel { get; init; } = -0.05;

    /// <summary>Absolute bound on every beta (decimal): |b_k| &lt;= this.</summary>
    public double MaxAbsBeta { get; init; } = 1.0;

    /// <summary>
    /// A spread fit estimates its decay(s) only with at least (parameter count + this) instruments in the fit; with fewer
    /// (a Nelson-Siegel spread over 4 to 6 bonds by default) the decays are held at values set by the group's durations,
    /// because so few quotes cannot tell the decay apart from their noise (see <c>SpreadDecayRange</c>). Base curves always
    /// estimate theirs. Common practice, no source: the same slack the outlier loop asks for.
    /// </summary>
    public int FreeSpreadDecayMinSurplus { get; init; } = 3;

    /// <summary>Iteration cap of a full fit from a cold start.</summary>
    public int MaxIterations { get; init; } = 200;

    /// <summary>Iteration cap of a warm start; if it does not converge within it the fitter falls back to a cold start.</summary>
    public int WarmMaxIterations { get; init; } = 25;

    /// <summary>Points of the cold-start decay grid (per decay; Svensson uses pairs with tau2 &gt; tau1).</summary>
    public int TauGridPoints { get; init; } = 10;

    /// <summary>Stop when an accepted step lowers the sum of squares by less than this fraction.</summary>
    public double RelativeCostTolerance { get; init; } = 1e-10;

    /// <summary>Stop when the RMSE falls below this (bp): the fit is exact to rounding.</summary>
    public double ExactFitRmseBp { get; init; } = 1e-7;

    /// <summary>Whether to drop outliers and refit.</summary>
    public bool RejectOutliers { get; init; } = true;

    /// <summary>An instrument is an outlier when |residual - median| &gt; max(k * 1.4826 * MAD, floor): this is k.</summary>
    public double OutlierMadMultiple { get; init; } = 5.0;

    /// <summary>The floor of the outlier threshold (bp), so an almost perfect fit does not shed good quotes.</summary>
    public double OutlierFloorBp { get; init; } = 10.0;

    /// <summary>Outliers are never dropped below (parameter count + this) instruments.</summary>
    public int OutlierMinSurplus { get; init; } = 3;

    /// <summary>Most outlier-rejection rounds (each a refit).</summary>
    public int MaxOutlierRounds { get; init; } = 5;

    internal int ParameterCount => FactorShape.ParameterCount(Model);

    internal void Validate()
    {
        if (!(MinTau > 0) || !(MaxTau > MinTau) || MaxTau > 100)
        {
            throw new ArgumentOutOfRangeException(nameof(MinTau), MinTau,
                FormattableString.Invariant($"CurveFitOptions: need 0 < MinTau < MaxTau <= 100, got MinTau={MinTau}, MaxTau={MaxTau}."));
        }
        if (!(MaxAbsBeta > 0) || !(MinLevel < MaxAbsBeta) || !(MinSpreadLevel < MaxAbsBeta))
        {
            throw new ArgumentOutOfRangeException(nameof(MaxAbsBeta), MaxAbsBeta,
                FormattableString.Invariant($"CurveFitOptions: need MaxAbsBeta > 0 and above MinLevel/MinSpreadLevel, got MaxAbsBeta={MaxAbsBeta}."));
        }
        if (FreeSpreadDecayMinSurplus < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(FreeSpreadDecayMinSurplus), FreeSpreadDecayMinSurplus,
                FormattableString.Invariant($"CurveFitOptions: need FreeSpreadDecayMinSurplus >= 0, got {FreeSpreadDecayMinSurplus}."));
        }
        if (MaxIterations < 1 || WarmMaxIterations < 1 || TauGridPoints < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(MaxIterations), MaxIterations,
                FormattableString.Invariant($"CurveFitOptions: need MaxIterations >= 1 (got {MaxIterations}), WarmMaxIterations >= 1 (got {WarmMaxIterations}), TauGridPoints >= 2 (got {TauGridPoints})."));
        }
    }
}
