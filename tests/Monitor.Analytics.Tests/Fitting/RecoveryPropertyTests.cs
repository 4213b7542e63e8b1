using FsCheck;
using FsCheck.Xunit;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Property (self-consistency, no external source): for any Nelson-Siegel curve in a realistic range (level 1-8%,
/// slope -4..+2%, curvature -4..+4%, decay 0.5-8 years) and any seeded set of 30 bonds priced exactly on it, the cold-start
/// fit reprices the bonds to RMSE &lt; 0.01 bp and reproduces the zero curve from 6 months to 30 years within 0.01 bp.
/// Decays below 0.5 years are left out on purpose: the hump then peaks (x = 1.79) inside the first coupon period, and
/// with bonds from 6 months on the slope and curvature loadings are almost collinear over the data, so the curve is
/// only identified to ~0.1 bp at the short end (this property found it: replay 4599161876222983936,4682725859299919283
/// with decay 0.30 gave prices to 3e-5 bp but a 6-month zero 0.07 bp off).
/// </summary>
public class RecoveryPropertyTests
{
    [Property(MaxTest = 25)]
    public bool Nelson_Siegel_curves_are_recovered_from_exact_prices(byte level, byte slope, byte curvature, byte decay, int seed)
    {
        var truth = new NelsonSiegelCurve(
            0.01 + 0.07 * level / 255.0,
            -0.04 + 0.06 * slope / 255.0,
            -0.04 + 0.08 * curvature / 255.0,
            0.5 * Math.Pow(8 / 0.5, decay / 255.0));
        var bonds = SyntheticBonds.Generate(30, seed, truth);
        var fit = new BondCurveFitter().Fit(bonds, new CurveFitOptions());
        if (!(fit.Report.RmseBp < 0.01))
        {
            return false;
        }
        for (var t = 0.5; t <= 30; t += 0.5)
        {
            if (Math.Abs(fit.Curve.ZeroRate(t) - truth.ZeroRate(t)) * 1e4 > 0.01)
            {
                return false;
            }
        }
        return true;
    }
}
