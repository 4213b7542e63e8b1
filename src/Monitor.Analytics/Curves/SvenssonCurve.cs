namespace Monitor.Analytics.Curves;

/// <summary>
/// Svensson (1994) extension of Nelson-Siegel with a second hump:
/// z(m) = b0 + b1 S(m/tau1) + b2 C(m/tau1) + b3 C(m/tau2).
/// Continuously compounded, decimals. This is the form of the Gurkaynak-Sack-Wright (2006)
/// published dataset, whose parameters are in percent: divide by 100 before use.
/// </summary>
public sealed class SvenssonCurve : IFactorCurve
{
    private static readonly string[] Names = ["level", "slope", "curvature", "curvature2"];

    /// <summary>Number of parameters in <see cref="ToArray"/> order (b0, b1, b2, b3, tau1, tau2).</summary>
    public const int ParameterCount = 6;

    public SvenssonCurve(double beta0, double beta1, double beta2, double beta3, double tau1, double tau2)
    {
        CurveParameterGuard.Finite(beta0, nameof(beta0));
        CurveParameterGuard.Finite(beta1, nameof(beta1));
        CurveParameterGuard.Finite(beta2, nameof(beta2));
        CurveParameterGuard.Finite(beta3, nameof(beta3));
        CurveParameterGuard.Decay(tau1, nameof(tau1));
        CurveParameterGuard.Decay(tau2, nameof(tau2));
        Beta0 = beta0;
        Beta1 = beta1;
        Beta2 = beta2;
        Beta3 = beta3;
        Tau1 = tau1;
        Tau2 = tau2;
    }

    public double Beta0 { get; }

    public double Beta1 { get; }

    public double Beta2 { get; }

    public double Beta3 { get; }

    public double Tau1 { get; }

    public double Tau2 { get; }

    public int FactorCount => 4;

    public IReadOnlyList<string> FactorNames => Names;

    /// <summary>Builds a curve from (b0, b1, b2, b3, tau1, tau2).</summary>
    public static SvenssonCurve FromArray(ReadOnlySpan<double> p)
    {
        if (p.Length != ParameterCount)
        {
            throw new ArgumentException($"Svensson needs {ParameterCount} parameters (b0, b1, b2, b3, tau1, tau2), got {p.Length}.", nameof(p));
        }
        return new SvenssonCurve(p[0], p[1], p[2], p[3], p[4], p[5]);
    }

    /// <summary>Parameters as (b0, b1, b2, b3, tau1, tau2).</summary>
    public double[] ToArray() => [Beta0, Beta1, Beta2, Beta3, Tau1, Tau2];

    public double ZeroRate(double t)
    {
        var x1 = t / Tau1;
        var x2 = t / Tau2;
        return Beta0
            + Beta1 * NelsonSiegelLoadings.Slope(x1)
            + Beta2 * NelsonSiegelLoadings.Curvature(x1)
            + Beta3 * NelsonSiegelLoadings.Curvature(x2);
    }

    public double Discount(double t) => Math.Exp(-ZeroRate(t) * t);

    public double InstantaneousForward(double t)
    {
        var x1 = t / Tau1;
        var x2 = t / Tau2;
        var e1 = Math.Exp(-x1);
        var e2 = Math.Exp(-x2);
        return Beta0 + Beta1 * e1 + Beta2 * x1 * e1 + Beta3 * x2 * e2;
    }

    public void Loadings(double t, Span<double> loadings)
    {
        var x1 = t / Tau1;
        loadings[0] = 1.0;
        loadings[1] = NelsonSiegelLoadings.Slope(x1);
        loadings[2] = NelsonSiegelLoadings.Curvature(x1);
        loadings[3] = NelsonSiegelLoadings.Curvature(t / Tau2);
    }

    public override string ToString() =>
        string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"Svensson(b0={Beta0:G6}, b1={Beta1:G6}, b2={Beta2:G6}, b3={Beta3:G6}, tau1={Tau1:G6}, tau2={Tau2:G6})");
}
