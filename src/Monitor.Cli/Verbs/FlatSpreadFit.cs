using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Cli.Verbs;

/// <summary>
/// The fallback for a thin spread group, one with fewer usable quotes than a Nelson-Siegel spread has parameters (4):
/// a flat spread g (s(m) = g, a Nelson-Siegel spread with g1 = g2 = 0 and tau = 1 year), fitted by Gauss-Newton on the
/// same duration-weighted price errors as the fitters: r_i = (P_i(g) - P_i) / (P_i D_i), with
/// P_i(g) = sum c exp(-(z_base(t) + g) t) and dP/dg = -sum c t exp(-(z_base + g) t). The objective is smooth and
/// almost linear in g, so a few steps converge (common practice for thin credit curves, no source).
/// </summary>
internal static class FlatSpreadFit
{
    private const int MaxIterations = 50;
    private const double FixedTau = 1.0;

    public static CurveFitResult Fit(IZeroCurve baseCurve, IReadOnlyList<FitInstrument> instruments, IReadOnlyList<FitExclusion> excluded)
    {
        var g = 0.0;
        var iterations = 0;
        var converged = false;
        var residuals = new double[instruments.Count];
        while (iterations < MaxIterations)
        {
            iterations++;
            double jr = 0, jj = 0;
            for (var i = 0; i < instruments.Count; i++)
            {
                var (price, slope) = Value(baseCurve, instruments[i], g);
                var scale = instruments[i].DirtyPrice * instruments[i].Duration;
                residuals[i] = (price - instruments[i].DirtyPrice) / scale;
                var j = slope / scale;
                jr += j * residuals[i];
                jj += j * j;
            }
            var step = jj > 0 ? -jr / jj : 0.0;
            g += step;
            if (Math.Abs(step) < 1e-12)
            {
                converged = true;
                break;
            }
        }
        for (var i = 0; i < instruments.Count; i++)
        {
            residuals[i] = (Value(baseCurve, instruments[i], g).Price - instruments[i].DirtyPrice) / (instruments[i].DirtyPrice * instruments[i].Duration);
        }
        var bp = residuals.Select(r => r * 1e4).ToArray();
        var worst = bp.Length == 0 ? -1 : Array.IndexOf(bp, bp.MaxBy(Math.Abs));
        var report = new FitReport(
            CurveModel.NelsonSiegel,
            FitSolver.Native,
            bp.Length == 0 ? 0 : Math.Sqrt(bp.Average(x => x * x)),
            worst < 0 ? 0 : Math.Abs(bp[worst]),
            worst < 0 ? null : instruments[worst].Id,
            iterations,
            converged,
            converged ? "flat spread converged (step below 1e-12)" : "flat spread: iteration limit reached",
            false,
            [.. instruments.Select(x => x.Id)],
            excluded,
            [.. instruments.Select((x, i) => new FitResidual(x.Id, bp[i], true))],
            [string.Create(CultureInfo.InvariantCulture,
                $"{instruments.Count} usable quote(s), fewer than the 4 a Nelson-Siegel spread needs: fitted a flat spread (g1 = g2 = 0, tau = {FixedTau} fixed)")]);
        var curve = new NelsonSiegelCurve(g, 0, 0, FixedTau);
        return new CurveFitResult(curve, curve.ToArray(), report);
    }

    private static (double Price, double Slope) Value(IZeroCurve baseCurve, FitInstrument instrument, double g)
    {
        double price = 0, slope = 0;
        for (var k = 0; k < instrument.Times.Length; k++)
        {
            var t = instrument.Times[k];
            if (t <= 0)
            {
                continue;
            }
            var pv = instrument.Amounts[k] * Math.Exp(-(baseCurve.ZeroRate(t) + g) * t);
            price += pv;
            slope -= t * pv;
        }
        return (price, slope);
    }
}
