namespace Monitor.Analytics.Dates;

/// <summary>ACT/360 (ISDA 2006, 4.16(e)): actual days / 360.</summary>
public sealed class Act360DayCounter : IDayCounter
{
    public DayCountConvention Convention => DayCountConvention.Act360;

    public int DayCount(DateOnly start, DateOnly end) => end.DayNumber - start.DayNumber;

    public double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency) =>
        DayCount(start, end) / 360.0;
}
