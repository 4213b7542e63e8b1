namespace Monitor.Analytics.Fitting;

/// <summary>The parametric zero curve a fitter estimates.</summary>
public enum CurveModel
{
    /// <summary>Nelson-Siegel (1987): parameters (b0, b1, b2, tau).</summary>
    NelsonSiegel,

    /// <summary>Svensson (1994): parameters (b0, b1, b2, b3, tau1, tau2).</summary>
    Svensson,
}
