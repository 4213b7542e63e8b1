using Monitor.Analytics.Curves;

namespace Monitor.Cli.Demo;

/// <summary>
/// The invented "true" market of the demo day: a Nelson-Siegel government curve and Nelson-Siegel spread curves
/// (UTIL-A, INDUSTRIAL-BBB) as functions of the fraction of the day elapsed, f in [0, 1]. Rates sell off through the
/// day (level +35 bp, the short end +30 bp) and INDUSTRIAL-BBB widens by 45 bp around midday. A seeded random walk of
/// about 0.3 bp per step on the government level keeps the tape alive. Rates are decimals (0.01 = 1%).
/// </summary>
internal sealed class MarketPath
{
    private readonly double[] _wiggle;

    public MarketPath(int seed, int steps)
    {
        var random = new Random(seed);
        _wiggle = new double[steps + 1];
        for (var i = 1; i <= steps; i++)
        {
            _wiggle[i] = _wiggle[i - 1] + 0.00003 * Gaussian.Next(random);
        }
    }

    /// <summary>Government curve at day fraction <paramref name="f"/> and random-walk step <paramref name="step"/>.</summary>
    public NelsonSiegelCurve Government(double f, int step)
    {
        var selloff = Smooth(f, 0.10, 0.75);
        var wiggle = _wiggle[Math.Clamp(step, 0, _wiggle.Length - 1)];
        // beta0 + beta1 is the short rate: level +35 bp and beta1 -5 bp lift the short end by 30 bp.
        return new NelsonSiegelCurve(0.0445 + 0.0035 * selloff + wiggle, -0.0150 - 0.0005 * selloff, -0.0060, 2.2);
    }

    /// <summary>Spread curve (added to the government zero rate) of <paramref name="spreadGroup"/> at day fraction <paramref name="f"/>.</summary>
    public NelsonSiegelCurve Spread(string spreadGroup, double f) => spreadGroup switch
    {
        "UTIL-A" => new NelsonSiegelCurve(0.0095 + 0.0003 * Smooth(f, 0.2, 0.8), -0.0035, 0.0010, 2.5),
        "INDUSTRIAL-BBB" => new NelsonSiegelCurve(0.0210 + 0.0045 * Smooth(f, 0.28, 0.55), -0.0060, 0.0020, 2.5),
        _ => throw new ArgumentException($"spreadGroup '{spreadGroup}' has no demo spread curve; use UTIL-A or INDUSTRIAL-BBB.", nameof(spreadGroup)),
    };

    /// <summary>0 before <paramref name="from"/>, 1 after <paramref name="to"/>, the smoothstep 3x^2 - 2x^3 between.</summary>
    private static double Smooth(double f, double from, double to)
    {
        var x = Math.Clamp((f - from) / (to - from), 0.0, 1.0);
        return x * x * (3 - 2 * x);
    }
}
