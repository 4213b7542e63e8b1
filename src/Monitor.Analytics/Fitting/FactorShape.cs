using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// Zero rate and its gradient in the parameters for Nelson-Siegel and Svensson, in ToArray order.
/// dz/db_k = L_k(t) (L_0 = 1); dz/dtau = (b1 S'(x) + b2 C'(x)) dx/dtau with dx/dtau = -t/tau^2 = -x/tau;
/// for Svensson dz/dtau2 = b3 C'(x2) (-x2/tau2). One exp per decay; series near x = 0 as in
/// <see cref="NelsonSiegelLoadings"/>.
/// </summary>
internal static class FactorShape
{
    private const double SeriesThreshold = 1e-4;

    public static int ParameterCount(CurveModel model) => model == CurveModel.NelsonSiegel ? 4 : 6;

    public static int FactorCount(CurveModel model) => model == CurveModel.NelsonSiegel ? 3 : 4;

    /// <summary>Indices of the decay parameters.</summary>
    public static bool IsDecay(CurveModel model, int k) => model == CurveModel.NelsonSiegel ? k == 3 : k >= 4;

    public static IFactorCurve ToCurve(CurveModel model, ReadOnlySpan<double> p) =>
        model == CurveModel.NelsonSiegel ? NelsonSiegelCurve.FromArray(p) : SvenssonCurve.FromArray(p);

    /// <summary>Factor loadings at t for the decays in p (length FactorCount).</summary>
    public static void Loadings(CurveModel model, ReadOnlySpan<double> p, double t, Span<double> loadings)
    {
        var tau1 = model == CurveModel.NelsonSiegel ? p[3] : p[4];
        Loads(t / tau1, out var s, out var c, out _, out _);
        loadings[0] = 1.0;
        loadings[1] = s;
        loadings[2] = c;
        if (model == CurveModel.Svensson)
        {
            Loads(t / p[5], out _, out var c2, out _, out _);
            loadings[3] = c2;
        }
    }

    /// <summary>Returns z(t); writes dz/dp into <paramref name="gradient"/> (length ParameterCount).</summary>
    public static double ZeroAndGradient(CurveModel model, ReadOnlySpan<double> p, double t, Span<double> gradient)
    {
        if (model == CurveModel.NelsonSiegel)
        {
            var x = t / p[3];
            Loads(x, out var s, out var c, out var ds, out var dc);
            gradient[0] = 1.0;
            gradient[1] = s;
            gradient[2] = c;
            gradient[3] = (p[1] * ds + p[2] * dc) * (-x / p[3]);
            return p[0] + p[1] * s + p[2] * c;
        }
        var x1 = t / p[4];
        var x2 = t / p[5];
        Loads(x1, out var s1, out var c1, out var ds1, out var dc1);
        Loads(x2, out _, out var c2, out _, out var dc2);
        gradient[0] = 1.0;
        gradient[1] = s1;
        gradient[2] = c1;
        gradient[3] = c2;
        gradient[4] = (p[1] * ds1 + p[2] * dc1) * (-x1 / p[4]);
        gradient[5] = p[3] * dc2 * (-x2 / p[5]);
        return p[0] + p[1] * s1 + p[2] * c1 + p[3] * c2;
    }

    /// <summary>Zero rate only.</summary>
    public static double Zero(CurveModel model, ReadOnlySpan<double> p, double t)
    {
        if (model == CurveModel.NelsonSiegel)
        {
            Loads(t / p[3], out var s, out var c, out _, out _);
            return p[0] + p[1] * s + p[2] * c;
        }
        Loads(t / p[4], out var s1, out var c1, out _, out _);
        Loads(t / p[5], out _, out var c2, out _, out _);
        return p[0] + p[1] * s1 + p[2] * c1 + p[3] * c2;
    }

    // S = (1 - e^-x)/x, C = S - e^-x, S' = (e^-x (1 + x) - 1)/x^2 = (e^-x - S)/x, C' = S' + e^-x.
    private static void Loads(double x, out double s, out double c, out double ds, out double dc)
    {
        if (Math.Abs(x) < SeriesThreshold)
        {
            s = NelsonSiegelLoadings.Slope(x);
            c = NelsonSiegelLoadings.Curvature(x);
            ds = NelsonSiegelLoadings.SlopeDerivative(x);
            dc = NelsonSiegelLoadings.CurvatureDerivative(x);
            return;
        }
        var e = Math.Exp(-x);
        s = (1.0 - e) / x;
        c = s - e;
        ds = (e - s) / x;
        dc = ds + e;
    }
}
