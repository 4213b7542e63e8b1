namespace Monitor.Analytics.Curves;

/// <summary>
/// The Nelson-Siegel (1987) loadings as functions of x = m / tau:
/// slope S(x) = (1 - e^-x) / x, curvature C(x) = S(x) - e^-x.
/// Near x = 0 the closed forms lose precision, so a short Taylor series is used there.
/// </summary>
public static class NelsonSiegelLoadings
{
    private const double SeriesThreshold = 1e-4;

    /// <summary>Slope loading (1 - e^-x)/x; 1 at x = 0, 0 at infinity.</summary>
    public static double Slope(double x)
    {
        if (Math.Abs(x) < SeriesThreshold)
        {
            // 1 - x/2 + x^2/6 - x^3/24
            return 1.0 - x * (0.5 - x * (1.0 / 6.0 - x / 24.0));
        }
        return -double.ExpM1(-x) / x;
    }

    /// <summary>Curvature loading (1 - e^-x)/x - e^-x; 0 at both ends, maximum 0.2984256 at x = 1.7932821329.</summary>
    public static double Curvature(double x)
    {
        if (Math.Abs(x) < SeriesThreshold)
        {
            // x/2 - x^2/3 + x^3/8
            return x * (0.5 - x * (1.0 / 3.0 - x / 8.0));
        }
        return -double.ExpM1(-x) / x - Math.Exp(-x);
    }

    /// <summary>dS/dx = (e^-x (1 + x) - 1) / x^2.</summary>
    public static double SlopeDerivative(double x)
    {
        if (Math.Abs(x) < SeriesThreshold)
        {
            return -0.5 + x / 3.0 - x * x / 8.0;
        }
        var e = Math.Exp(-x);
        return (e * (1.0 + x) - 1.0) / (x * x);
    }

    /// <summary>dC/dx = dS/dx + e^-x.</summary>
    public static double CurvatureDerivative(double x) => SlopeDerivative(x) + Math.Exp(-x);
}
