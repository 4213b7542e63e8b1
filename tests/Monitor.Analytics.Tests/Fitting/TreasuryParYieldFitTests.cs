using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Xunit.Abstractions;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Fits to the US Treasury "Daily Treasury Par Yield Curve Rates" (Data/par-yields-published-sample.csv) and
/// comparison with the Gurkaynak-Sack-Wright (2006) published Svensson curve of the same day (feds200628,
/// Data/svensson-published-sample.csv). See Data/README.md.
/// </summary>
public class TreasuryParYieldFitTests(ITestOutputHelper output)
{
    public static TheoryData<string, CurveModel> DatesAndModels()
    {
        var data = new TheoryData<string, CurveModel>();
        foreach (var row in ReferenceData.Treasury())
        {
            data.Add(row.Date, CurveModel.NelsonSiegel);
            data.Add(row.Date, CurveModel.Svensson);
        }
        return data;
    }

    private static List<ParYieldPoint> Points(ReferenceData.TreasuryRow row) =>
        [.. row.Points.Select(p => new ParYieldPoint(p.Tenor, p.ParPercent / 100))];

    [Theory]
    [MemberData(nameof(DatesAndModels))]
    public void Fit_to_published_par_yields_skips_blank_tenors_and_fits_closely(string date, CurveModel model)
    {
        var row = ReferenceData.Treasury().Single(r => r.Date == date);
        var fit = new ParYieldCurveFitter().Fit(Points(row), new CurveFitOptions { Model = model, RejectOutliers = false });
        output.WriteLine(FormattableString.Invariant(
            $"{date} {model}: {fit.Curve}; RMSE {fit.Report.RmseBp:F2} bp, max {fit.Report.MaxAbsErrorBp:F2} bp at {fit.Report.MaxAbsErrorId}; {fit.Report.Iterations} it; notes: {string.Join("; ", fit.Report.Notes)}"));

        // Source: the Treasury file leaves 2M and 4M blank before 2018 (Data/README.md): each blank tenor is skipped with a note.
        var blanks = row.Points.Count(p => p.ParPercent is null);
        Assert.Equal(blanks, fit.Report.Notes.Count(n => n.Contains("no par yield", StringComparison.Ordinal)));
        Assert.Equal(row.Points.Length - blanks, fit.Report.UsedIds.Count);
        Assert.True(fit.Report.Converged, fit.Report.ExitReason);

        // The residuals the report gives are the par yields of the fitted curve by ParYield.Compute (frequency 2).
        foreach (var r in fit.Report.Residuals)
        {
            var tenor = row.Points.Select(p => p.Tenor).Single(t => ParYieldCurveFitter.TenorLabel(t) == r.Id);
            var published = row.Points.Single(p => p.Tenor == tenor).ParPercent!.Value / 100;
            Assert.Equal(published - ParYield.Compute(fit.Curve, tenor, 2), r.ResidualBp / 1e4, 12);
        }

        // Bound: a 3- or 4-factor smooth curve through 11-13 published constant-maturity points cannot pass through all of
        // them. Measured RMSE on these four dates (test output): Nelson-Siegel 2.2 to 9.0 bp (largest 2002-01-24),
        // Svensson 1.7 to 6.3 bp. Bounds 15 bp (NS) and 10 bp (Svensson) leave margin and still fail a fit stuck in a
        // wrong basin or stopped early (tens of bp).
        var bound = model == CurveModel.NelsonSiegel ? 15.0 : 10.0;
        Assert.True(fit.Report.RmseBp < bound, FormattableString.Invariant($"RMSE {fit.Report.RmseBp:F2} bp"));
    }

    [Theory]
    [InlineData("2002-01-24", 30.0)]
    [InlineData("2011-05-20", 20.0)]
    [InlineData("2017-04-06", 20.0)]
    public void Svensson_fit_to_Treasury_par_yields_is_close_to_the_published_GSW_curve(string date, double boundBp)
    {
        var treasury = ReferenceData.Treasury().Single(r => r.Date == date);
        var gsw = ReferenceData.Gsw().Single(r => r.Date == date);
        var fit = new ParYieldCurveFitter().Fit(Points(treasury), new CurveFitOptions { Model = CurveModel.Svensson, RejectOutliers = false });
        var nsFit = new ParYieldCurveFitter().Fit(Points(treasury), new CurveFitOptions { Model = CurveModel.NelsonSiegel, RejectOutliers = false });
        double maxZero = 0, maxPar = 0, maxNsPar = 0;
        var lines = new List<string> { "n  zero_fit  zero_pub  dz(bp)  par_fit  par_pub  dpar(bp)  par_NS  dparNS(bp)" };
        for (var n = 1; n <= 30; n++)
        {
            var zFit = fit.Curve.ZeroRate(n) * 100;
            var pFit = ParYield.Compute(fit.Curve, n, 2) * 100;
            var pNs = ParYield.Compute(nsFit.Curve, n, 2) * 100;
            var dz = (zFit - gsw.ZeroPercent[n - 1]) * 100;
            var dp = (pFit - gsw.ParPercent[n - 1]) * 100;
            var dpNs = (pNs - gsw.ParPercent[n - 1]) * 100;
            maxZero = Math.Max(maxZero, Math.Abs(dz));
            maxPar = Math.Max(maxPar, Math.Abs(dp));
            maxNsPar = Math.Max(maxNsPar, Math.Abs(dpNs));
            lines.Add(string.Create(CultureInfo.InvariantCulture,
                $"{n,2} {zFit,8:F4} {gsw.ZeroPercent[n - 1],8:F4} {dz,7:F2} {pFit,8:F4} {gsw.ParPercent[n - 1],8:F4} {dp,7:F2} {pNs,8:F4} {dpNs,7:F2}"));
        }
        output.WriteLine(FormattableString.Invariant(
            $"{date}: max |zero diff| {maxZero:F1} bp, max |par diff| {maxPar:F1} bp (Svensson); NS max |par diff| {maxNsPar:F1} bp"));
        foreach (var l in lines)
        {
            output.WriteLine(l);
        }

        // Bound (measured first, then margin). The Treasury par curve is read off on-the-run securities; GSW fit off-the-run
        // notes and bonds and leave out the newest issues (Gurkaynak, Sack and Wright 2006, FEDS 2006-28, section on data
        // selection; from memory), so the two curves differ by the on-the-run premium and by the fitting sets, most at the
        // long end where our curve sits below theirs. Measured maxima over 1..30 years (Svensson fit): 2002-01-24 zero 19.2 bp,
        // par 17.9 bp; 2011-05-20 zero 11.3 bp, par 9.4 bp; 2017-04-06 zero 11.5 bp, par 9.3 bp. Bounds: 30 bp for early 2002
        // (steep curve, thin long end; the reference README expects more there) and 20 bp for the others: margin over the
        // measurements, yet a fit off by a few tenths of a percent fails.
        Assert.True(maxPar < boundBp, FormattableString.Invariant($"{date}: max par difference {maxPar:F1} bp"));
        Assert.True(maxZero < boundBp, FormattableString.Invariant($"{date}: max zero difference {maxZero:F1} bp"));
    }
}
