namespace Monitor.Analytics.Dates;

/// <summary>Counts days and year fractions under one <see cref="DayCountConvention"/>.</summary>
public interface IDayCounter
{
    DayCountConvention Convention { get; }

    /// <summary>Days from <paramref name="start"/> to <paramref name="end"/> under the convention (negative if end precedes start).</summary>
    int DayCount(DateOnly start, DateOnly end);

    /// <summary>
    /// Year fraction from <paramref name="start"/> to <paramref name="end"/>. Only ACT/ACT (ICMA) uses the
    /// reference coupon period [<paramref name="referenceStart"/>, <paramref name="referenceEnd"/>] and the
    /// coupon <paramref name="frequency"/> (payments per year); the other conventions ignore them.
    /// </summary>
    double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency);
}
