using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>
/// Turns factor exposures into the money figures limits bound (see <see cref="ExposureMeasure"/>):
/// money per bp for factors, C x P x 1e-8 for level convexity.
/// </summary>
public static class ExposureMapping
{
    private const double BasisPointSquared = 1e-8;

    private static readonly IReadOnlyDictionary<string, IReadOnlyDictionary<ExposureMeasure, double>> NoSpreadGroups =
        new Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>();

    public static MeasureFigures Measures(FactorExposures e)
    {
        ArgumentNullException.ThrowIfNull(e);
        return new MeasureFigures(measure => measure switch
        {
            ExposureMeasure.MarketValue => e.Value,
            ExposureMeasure.Dv01 => e.Dv01,
            ExposureMeasure.BaseLevel => e.BaseMoneyPerBp(0),
            ExposureMeasure.BaseSlope => e.BaseMoneyPerBp(1),
            ExposureMeasure.BaseCurvature => e.BaseMoneyPerBp(2),
            ExposureMeasure.SpreadLevel => e.SpreadFactorCount > 0 ? e.SpreadMoneyPerBp(0) : 0.0,
            ExposureMeasure.SpreadSlope => e.SpreadFactorCount > 1 ? e.SpreadMoneyPerBp(1) : 0.0,
            ExposureMeasure.SpreadCurvature => e.SpreadFactorCount > 2 ? e.SpreadMoneyPerBp(2) : 0.0,
            ExposureMeasure.Convexity => e.BaseMoneyConvexity(0, 0) * BasisPointSquared,
            _ => throw new ArgumentOutOfRangeException(nameof(measure), measure, "has no mapping from factor exposures."),
        });
    }

    public static BookExposures ToBookExposures(BookRisk risk)
    {
        ArgumentNullException.ThrowIfNull(risk);
        Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>? bySpreadGroup = null;
        foreach (var (key, exposures) in risk.ByCurveKey)
        {
            if (!CurveKey.IsGovernment(key))
            {
                bySpreadGroup ??= new Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>(StringComparer.Ordinal);
                bySpreadGroup[key] = Measures(exposures);
            }
        }
        return new BookExposures { Totals = Measures(risk.Total), BySpreadGroup = bySpreadGroup ?? NoSpreadGroups };
    }
}
