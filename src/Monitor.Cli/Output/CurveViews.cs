using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Market;
using Monitor.Cli.Verbs;

namespace Monitor.Cli.Output;

/// <summary>Builds the <see cref="CurveView"/> of a fitted curve (bond or par-yield fit).</summary>
internal static class CurveViews
{
    /// <summary>The tenors printed unless the user asks for others (fit --tenors).</summary>
    public const string StandardTenors = "3M,1,2,5,10,20,30";

    private static readonly double[] Standard = [0.25, 1, 2, 5, 10, 20, 30];

    public static CurveView Of(FittedCurve fitted) => Of(fitted, Standard);

    public static CurveView Of(FittedCurve fitted, IReadOnlyList<double> tenors)
    {
        var byId = fitted.Quotes.ToDictionary(q => q.Bond.Id, StringComparer.Ordinal);
        var residuals = fitted.Result.Report.Residuals.Select(r => byId.TryGetValue(r.Id, out var q)
            ? new ResidualView(r.Id, Num.Date(q.Bond.MaturityDate), q.CleanPrice, 100 * q.Yield, r.ResidualBp, r.Used)
            : new ResidualView(r.Id, null, null, null, r.ResidualBp, r.Used));
        return Build(fitted.Label, fitted.IsGovernment ? "base" : "spread", fitted.Result, fitted.Gate, fitted.Verdict, residuals.ToArray(), tenors);
    }

    /// <summary>
    /// A par-yield fit: residuals are published minus model par yield in bp, one per tenor of the file; a tenor the
    /// fit left out is kept with <c>used</c> false: an outlier keeps its residual, a tenor without a published yield
    /// has neither yield nor residual (null in JSON).
    /// </summary>
    public static CurveView OfParYields(
        CurveFitResult result, FitQualityGate gate, FitQualityVerdict verdict, IReadOnlyDictionary<string, double> publishedByTenor,
        IReadOnlyList<string> blankTenors, IReadOnlyList<double> tenors)
    {
        var residuals = result.Report.Residuals
            .Select(r => new ResidualView(r.Id, null, null, publishedByTenor.TryGetValue(r.Id, out var y) ? 100 * y : null, r.ResidualBp, r.Used))
            .Concat(blankTenors.Select(t => new ResidualView(t, null, null, null, double.NaN, false)))
            .OrderBy(r => Tenor.TryParseYears(r.Id, out var years) ? years : double.MaxValue)
            .ToArray();
        return Build("par-yields", "base", result, gate, verdict, residuals, tenors);
    }

    private static CurveView Build(
        string label, string kind, CurveFitResult result, FitQualityGate gate, FitQualityVerdict verdict, IReadOnlyList<ResidualView> residuals, IReadOnlyList<double> tenors)
    {
        var report = result.Report;
        var spread = kind == "spread";
        return new CurveView(
            label,
            kind,
            report.Model == CurveModel.Svensson ? CommonOptions.Svensson : CommonOptions.NelsonSiegel,
            Parameters(result, spread),
            report.RmseBp,
            report.MaxAbsErrorBp,
            report.MaxAbsErrorId,
            report.Iterations,
            report.Converged,
            report.ExitReason,
            report.UsedIds.Count,
            report.Notes,
            new GateView(gate.MaxRmseBp, gate.MaxAbsErrorBp, gate.MinInstruments, verdict.Passed, verdict.Reasons),
            residuals,
            [.. report.Exclusions.Select(e => new ExclusionView(e.Id, e.Reason.ToString(), e.Detail))],
            [.. tenors.Select(t => Point(result.Curve, t, spread))]);
    }

    private static Dictionary<string, double> Parameters(CurveFitResult result, bool spread)
    {
        var p = result.Parameters;
        var beta = spread ? "g" : "b";
        string[] names = result.Report.Model == CurveModel.Svensson
            ? [$"{beta}0", $"{beta}1", $"{beta}2", $"{beta}3", "tau1", "tau2"]
            : [$"{beta}0", $"{beta}1", $"{beta}2", "tau"];
        var parameters = new Dictionary<string, double>(StringComparer.Ordinal);
        for (var i = 0; i < names.Length && i < p.Length; i++)
        {
            parameters[names[i]] = p[i];
        }
        return parameters;
    }

    private static CurvePointView Point(IZeroCurve curve, double years, bool spread)
    {
        var tenor = ParYieldCurveFitter.TenorLabel(years);
        return spread
            ? new CurvePointView(tenor, years, null, null, 1e4 * curve.ZeroRate(years))
            : new CurvePointView(tenor, years, 100 * curve.ZeroRate(years), 100 * ParYield.Compute(curve, years, ParYieldCurveFitter.Frequency), null);
    }
}
