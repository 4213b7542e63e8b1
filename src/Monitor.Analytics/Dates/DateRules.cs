namespace Monitor.Analytics.Dates;

/// <summary>Calendar arithmetic shared by day counts and coupon schedules.</summary>
public static class DateRules
{
    /// <summary>True when <paramref name="date"/> is the last day of its month.</summary>
    public static bool IsEndOfMonth(DateOnly date) => date.Day == DateTime.DaysInMonth(date.Year, date.Month);

    /// <summary>Last day of the month of <paramref name="date"/>.</summary>
    public static DateOnly EndOfMonth(DateOnly date) => new(date.Year, date.Month, DateTime.DaysInMonth(date.Year, date.Month));

    /// <summary>
    /// Adds <paramref name="months"/> to <paramref name="anchor"/> (day clamped to the month's length); with
    /// <paramref name="endOfMonth"/> the result is moved to the month end (the end-of-month rule: a bond maturing
    /// on 30 Apr pays on 31 Oct). Always step from a fixed anchor, never iteratively, or 31 -> 30 -> 28 drifts.
    /// </summary>
    public static DateOnly AddMonths(DateOnly anchor, int months, bool endOfMonth)
    {
        var date = anchor.AddMonths(months);
        return endOfMonth ? EndOfMonth(date) : date;
    }
}
