namespace Monitor.Analytics.Curves;

/// <summary>
/// Converts dates to curve time. Curves measure time as ACT/365F years from the valuation date:
/// common practice for fitted zero curves (no source), independent of each bond's coupon day count.
/// </summary>
public static class CurveTime
{
    /// <summary>Days per year of the curve's time measure.</summary>
    public const double DaysPerYear = 365.0;

    /// <summary>Years from <paramref name="valuationDate"/> to <paramref name="date"/> (negative before it).</summary>
    public static double YearsBetween(DateOnly valuationDate, DateOnly date) =>
        (date.DayNumber - valuationDate.DayNumber) / DaysPerYear;
}
