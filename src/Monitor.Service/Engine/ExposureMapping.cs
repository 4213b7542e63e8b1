using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>
/// Turns factor exposures into the money figures limits bound (see <see cref="ExposureMeasure"/>):
/// money per bp for factors, C x P x 1e-8 for level convexity.
/// </summary>
public static class ExposureMapping
{
    private const double BasisPoint = 1e-4;
    private const double BasisPointSquared = 1e-8;

    /// <summary>The spread-group breakdown of a book holding government bonds only (shared, never changed).</summary>
    internal static readonly IReadOnlyDictionary<string, IReadOnlyDictionary<ExposureMeasure, double>> NoSpreadGroups =
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

    /// <summary>
    /// <see cref="Measures(FactorExposures)"/> of exposures given by their money moments, written into
    /// <paramref name="measures"/> (one value per measure, enum order) with the same arithmetic, so equal bit for bit.
    /// </summary>
    /// <param name="baseFactorCount">Base factors (at least 3: level, slope, curvature).</param>
    /// <param name="spreadFactorCount">Spread factors of the exposures (0 for government flows).</param>
    /// <param name="value">Money value.</param>
    /// <param name="firstMoments">Money durations -dP/db_k, base factors then spread factors.</param>
    /// <param name="levelSecondMoment">d2P/db_0^2, the money convexity of the base level.</param>
    /// <param name="measures">At least <see cref="MeasureFigures.MeasureCount"/> long.</param>
    internal static void MeasuresFromMoments(
        int baseFactorCount, int spreadFactorCount, double value, ReadOnlySpan<double> firstMoments, double levelSecondMoment, Span<double> measures)
    {
        if (baseFactorCount < 3 || firstMoments.Length < baseFactorCount + spreadFactorCount || measures.Length < MeasureFigures.MeasureCount)
        {
            throw new ArgumentException("Measures need level, slope and curvature base factors, every first moment and a value per measure.");
        }
        measures[(int)ExposureMeasure.MarketValue] = value;
        measures[(int)ExposureMeasure.Dv01] = firstMoments[0] * BasisPoint;
        measures[(int)ExposureMeasure.BaseLevel] = firstMoments[0] * BasisPoint;
        measures[(int)ExposureMeasure.BaseSlope] = firstMoments[1] * BasisPoint;
        measures[(int)ExposureMeasure.BaseCurvature] = firstMoments[2] * BasisPoint;
        measures[(int)ExposureMeasure.SpreadLevel] = spreadFactorCount > 0 ? firstMoments[baseFactorCount] * BasisPoint : 0.0;
        measures[(int)ExposureMeasure.SpreadSlope] = spreadFactorCount > 1 ? firstMoments[baseFactorCount + 1] * BasisPoint : 0.0;
        measures[(int)ExposureMeasure.SpreadCurvature] = spreadFactorCount > 2 ? firstMoments[baseFactorCount + 2] * BasisPoint : 0.0;
        measures[(int)ExposureMeasure.Convexity] = levelSecondMoment * BasisPointSquared;
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
