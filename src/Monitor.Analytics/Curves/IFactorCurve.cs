namespace Monitor.Analytics.Curves;

/// <summary>
/// A zero curve that is linear in a few factors (the betas): z(t) = sum_k beta_k L_k(t).
/// Factor 0 is always the level (L_0 = 1). Exposures to the factors are computed from the loadings.
/// </summary>
public interface IFactorCurve : IZeroCurve
{
    /// <summary>Number of linear factors (3 for Nelson-Siegel, 4 for Svensson).</summary>
    int FactorCount { get; }

    /// <summary>Human-readable factor names, in loading order ("level", "slope", "curvature", ...).</summary>
    IReadOnlyList<string> FactorNames { get; }

    /// <summary>Writes dz(t)/dbeta_k for each factor into <paramref name="loadings"/> (length at least <see cref="FactorCount"/>).</summary>
    void Loadings(double t, Span<double> loadings);
}
