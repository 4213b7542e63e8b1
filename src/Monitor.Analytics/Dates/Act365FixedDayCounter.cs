namespace Monitor.Analytics.Dates;

/// <summary>ACT/365 (Fixed) (ISDA 2006, 4.16(d)): actual days / 365, leap years or not.</summary>
public sealed class Act365FixedDayCounter : IDayCounter
{
    public DayCountConvention Convention => DayCountConvention.Act365Fixed;

    public int DayCount(DateOnly start, DateOnly end) => end.DayNumber - start.DayNumber;

    public double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency) =>
        DayCount(start, end) / 365.0;
}
