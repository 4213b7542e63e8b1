namespace Monitor.Cli.Output;

/// <summary>
/// JSON: factor exposures of a position or a book. Money per bp is the money lost when the factor rises 1 bp
/// (positive for a long); durations are unit (years, value-weighted; null when the value is 0);
/// <c>levelConvexity</c> in years squared; <c>levelMoneyConvexity</c> = d2V/db0^2 x 1e-8 (money per bp squared).
/// Dictionaries are keyed by factor name (level, slope, curvature; Svensson adds curvature2).
/// </summary>
internal sealed record ExposureView(
    double Value,
    double Dv01,
    IReadOnlyDictionary<string, double> BaseMoneyPerBp,
    IReadOnlyDictionary<string, double> BaseDuration,
    IReadOnlyDictionary<string, double> SpreadMoneyPerBp,
    IReadOnlyDictionary<string, double> SpreadDuration,
    double LevelConvexity,
    double LevelMoneyConvexity);
