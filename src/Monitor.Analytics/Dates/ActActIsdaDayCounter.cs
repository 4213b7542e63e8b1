namespace Monitor.Analytics.Dates;

/// <summary>
/// ACT/ACT (ISDA) (ISDA 2006, 4.16(b)): days falling in a leap year / 366 + days in a non-leap year / 365.
/// The start date counts, the end date does not.
/// </summary>
public sealed class ActActIsdaDayCounter : IDayCounter
{
    public DayCountConvention Convention => DayCountConvention.ActActIsda;

    public int DayCount(DateOnly start, DateOnly end) => end.DayNumber - start.DayNumber;

    public double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency)
    {
        if (end < start)
        {
            return -YearFraction(end, start, referenceStart, referenceEnd, frequency);
        }

        double sum = 0;
        var cursor = start;
        while (cursor < end)
        {
            var nextYear = new DateOnly(cursor.Year + 1, 1, 1);
            var stop = nextYear < end ? nextYear : end;
            sum += (stop.DayNumber - cursor.DayNumber) / (DateTime.IsLeapYear(cursor.Year) ? 366.0 : 365.0);
            cursor = stop;
        }

        return sum;
    }
}
