namespace Monitor.Analytics.Dates;

/// <summary>30E/360 Eurobond Basis (ISDA 2006, 4.16(g)): any day 31 becomes 30; February is not adjusted.</summary>
public sealed class Thirty360EuropeanDayCounter : IDayCounter
{
    public DayCountConvention Convention => DayCountConvention.Thirty360European;

    public int DayCount(DateOnly start, DateOnly end)
    {
        var d1 = Math.Min(start.Day, 30);
        var d2 = Math.Min(end.Day, 30);
        return (360 * (end.Year - start.Year)) + (30 * (end.Month - start.Month)) + (d2 - d1);
    }

    public double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency) =>
        DayCount(start, end) / 360.0;
}
