namespace Monitor.Analytics.Dates;

/// <summary>
/// 30/360 Bond Basis (ISDA 2006, 4.16(f)): 360(Y2-Y1) + 30(M2-M1) + (D2-D1), with D1 = 31 -> 30 and
/// D2 = 31 -> 30 only if D1 (after adjustment) is 30. Trap: February month-ends are NOT adjusted
/// (28 Feb -> 31 Mar 2008 is 33 days), unlike the US "30/360 SIA" variant.
/// </summary>
public sealed class Thirty360BondBasisDayCounter : IDayCounter
{
    public DayCountConvention Convention => DayCountConvention.Thirty360BondBasis;

    public int DayCount(DateOnly start, DateOnly end)
    {
        var d1 = start.Day == 31 ? 30 : start.Day;
        var d2 = end.Day == 31 && d1 == 30 ? 30 : end.Day;
        return (360 * (end.Year - start.Year)) + (30 * (end.Month - start.Month)) + (d2 - d1);
    }

    public double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency) =>
        DayCount(start, end) / 360.0;
}
