using System.Globalization;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// The gate a fitted curve must pass before it is published: RMSE and largest absolute residual
/// in basis points of yield, a minimum number of instruments used, and (optionally) convergence.
/// </summary>
public sealed record FitQualityGate(double MaxRmseBp, double MaxAbsErrorBp, int MinInstruments, bool RequireConvergence = true)
{
    /// <summary>Checks a report against the gate; every failed condition gives one reason.</summary>
    public FitQualityVerdict Evaluate(FitReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        var reasons = new List<string>();
        if (!(report.RmseBp <= MaxRmseBp))
        {
            reasons.Add(Format($"RMSE {report.RmseBp:F2} bp exceeds the limit of {MaxRmseBp:F2} bp"));
        }
        if (!(report.MaxAbsErrorBp <= MaxAbsErrorBp))
        {
            reasons.Add(Format($"largest residual {report.MaxAbsErrorBp:F2} bp ({report.MaxAbsErrorId}) exceeds the limit of {MaxAbsErrorBp:F2} bp"));
        }
        if (report.UsedIds.Count < MinInstruments)
        {
            reasons.Add(Format($"only {report.UsedIds.Count} instruments used, at least {MinInstruments} required"));
        }
        if (RequireConvergence && !report.Converged)
        {
            reasons.Add("the fit did not converge: " + report.ExitReason);
        }
        return new FitQualityVerdict(reasons.Count == 0, reasons);
    }

    private static string Format(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
