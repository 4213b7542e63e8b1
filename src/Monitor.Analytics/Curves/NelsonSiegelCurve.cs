namespace Monitor.Analytics.Curves;

/// <summary>
/// Nelson-Siegel (1987) zero curve, continuously compounded, maturity m in years:
/// z(m) = b0 + b1 S(m/tau) + b2 C(m/tau), with S and C from <see cref="NelsonSiegelLoadings"/>.
/// b0 is the long-end level, b0 + b1 the short end; an upward-sloping curve has b1 &lt; 0.
/// Rates are decimals (0.05 = 5%).
/// </summary>
public sealed class NelsonSiegelCurve : IFactorCurve
{
    private static readonly string[] Names = ["level", "slope", "curvature"];

    /// <summary>Number of parameters in <see cref="ToArray"/> order (b0, b1, b2, tau).</summary>
    public const int ParameterCount = 4;

    public NelsonSiegelCurve(double beta0, double beta1, double beta2, double tau)
    {
        CurveParameterGuard.Finite(beta0, nameof(beta0));
        CurveParameterGuard.Finite(beta1, nameof(beta1));
        CurveParameterGuard.Finite(beta2, nameof(beta2));
        CurveParameterGuard.Decay(tau, nameof(tau));
        Beta0 = beta0;
        Beta1 = beta1;
        Beta2 = beta2;
        Tau = tau;
    }

    /// <summary>Level: the zero rate at infinite maturity.</summary>
    public double Beta0 { get; }

    /// <summary>Slope: the short rate minus the level.</summary>
    public double Beta1 { get; }

    /// <summary>Curvature: weight of the hump loading.</summary>
    public double Beta2 { get; }

    /// <summary>Decay in years (&gt; 0): where slope and curvature loadings act.</summary>
    public double Tau { get; }

    public int FactorCount => 3;

    public IReadOnlyList<string> FactorNames => Names;

    /// <summary>Builds a curve from (b0, b1, b2, tau).</summary>
    public static NelsonSiegelCurve FromArray(ReadOnlySpan<double> p)
    {
        if (p.Length != ParameterCount)
        {
            throw new ArgumentException($"Nelson-Siegel needs {ParameterCount} parameters (b0, b1, b2, tau), got {p.Length}.", nameof(p));
        }
        return new NelsonSiegelCurve(p[0], p[1], p[2], p[3]);
    }

    /// <summary>Parameters as (b0, b1, b2, tau).</summary>
    public double[] ToArray() => [Beta0, Beta1, Beta2, Tau];

    public double ZeroRate(double t)
    {
        var x = t / Tau;
        return Beta0 + Beta1 * NelsonSiegelLoadings.Slope(x) + Beta2 * NelsonSiegelLoadings.Curvature(x);
    }

    public double Discount(double t) => Math.Exp(-ZeroRate(t) * t);

    /// <summary>f(m) = b0 + b1 e^-x + b2 x e^-x, x = m / tau.</summary>
    public double InstantaneousForward(double t)
    {
        var x = t / Tau;
        var e = Math.Exp(-x);
        return Beta0 + Beta1 * e + Beta2 * x * e;
    }

    public void Loadings(double t, Span<double> loadings)
    {
        var x = t / Tau;
        loadings[0] = 1.0;
        loadings[1] = NelsonSiegelLoadings.Slope(x);
        loadings[2] = NelsonSiegelLoadings.Curvature(x);
    }

    public override string ToString() =>
        string.Create(System.Globalization.CultureInfo.InvariantCulture, $"NS(b0={Beta0:G6}, b1={Beta1:G6}, b2={Beta2:G6}, tau={Tau:G6})");
}
