namespace Monitor.Limits;

/// <summary>
/// A limit's status moved. <see cref="LimitValue"/> is the bound on the exposure's side (or, when that
/// side is unbounded, the other bound); <see cref="Utilisation"/> = Exposure / LimitValue on the side
/// approached, 0 when that side is unbounded. Exposure and limit are in the measure's units.
/// </summary>
public sealed record LimitStatusChange(
    string LimitId,
    LimitScope Scope,
    ExposureMeasure Measure,
    LimitStatus Previous,
    LimitStatus Current,
    double Exposure,
    double LimitValue,
    double Utilisation);
