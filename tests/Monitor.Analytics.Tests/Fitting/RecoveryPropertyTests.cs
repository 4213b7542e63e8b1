using FsCheck;
using FsCheck.Xunit;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Property (self-consistency, no external source): for any Nelson-Siegel curve in a realistic range (level 1-8%,
/// slope -4..+2%, curvature -4..+4%, decay 0.5-8 years) and any seeded set of 30 bonds priced exactly on it, the cold-start
/// fit reprices the bonds to RMSE &lt; 0.01 bp (the bound) and reproduces the zero curve from 2 to 30 years
/// within 0.1 bp, and from 6 months to 2 years within 1 bp. The curve bounds are looser than the price bound on purpose: with a short decay and a small curvature
/// the slope and curvature loadings are almost collinear over bonds that start at 6 months, so prices fix the curve
/// there only to a fraction of a bp (this property found it: replay 8928426347231363508,8432000847867383849, decay
/// 0.61 and curvature -0.5%, repriced to 3e-4 bp with a 6-month zero 0.8 bp off and the long end 0.03 bp off: the
/// solver stops in a flat valley where the price error no longer moves). Decays start at 0.5 years for the
/// same reason: below it the hump peaks inside the first coupon period.
/// </summary>
public class RecoveryPropertyTests
{
    [Property(MaxTest = 50)]
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
            var bound = t < 2 ? 1.0 : 0.1;
            if (Math.Abs(fit.Curve.ZeroRate(t) - truth.ZeroRate(t)) * 1e4 > bound)
            {
                return false;
            }
        }
        return true;
    }
}
