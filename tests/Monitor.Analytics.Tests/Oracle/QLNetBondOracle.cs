using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using QL = QLNet;

namespace Monitor.Analytics.Tests.Oracle;

/// <summary>
/// Builds the QLNet (1.13.2) twin of one of our bonds: an explicit, unadjusted schedule of our coupon dates with our
/// regular/irregular flags, so QLNet derives the same reference periods (end - tenor for an odd first period,
/// start + tenor for an odd last one), and QLNet's yield conventions (Compounded at the coupon frequency).
/// </summary>
internal static class QLNetBondOracle
{
    public static QL.Date ToQl(DateOnly d) => new(d.Day, d.Month, d.Year);

    public static QL.Frequency Frequency(int f) => f switch
    {
        1 => QL.Frequency.Annual,
        2 => QL.Frequency.Semiannual,
        4 => QL.Frequency.Quarterly,
        12 => QL.Frequency.Monthly,
        _ => throw new ArgumentOutOfRangeException(nameof(f), f, "no QLNet frequency"),
    };

    public static QL.DayCounter DayCounter(DayCountConvention convention) => convention switch
    {
        DayCountConvention.ActActIcma => new QL.ActualActual(QL.ActualActual.Convention.ISMA, null),
        DayCountConvention.ActActIsda => new QL.ActualActual(QL.ActualActual.Convention.ISDA, null),
        DayCountConvention.Thirty360BondBasis => new QL.Thirty360(QL.Thirty360.Thirty360Convention.BondBasis, null),
        DayCountConvention.Thirty360European => new QL.Thirty360(QL.Thirty360.Thirty360Convention.European, null),
        DayCountConvention.Act360 => new QL.Actual360(),
        DayCountConvention.Act365Fixed => new QL.Actual365Fixed(),
        _ => throw new ArgumentOutOfRangeException(nameof(convention), convention, "no QLNet day counter"),
    };

    /// <summary>The QLNet bond with our schedule and the given accrual day counter.</summary>
    public static QL.FixedRateBond Build(Bond bond, QL.DayCounter dayCounter)
    {
        var periods = bond.Schedule ?? throw new ArgumentException("coupon bonds only", nameof(bond));
        var dates = new List<QL.Date> { ToQl(bond.IssueDate) };
        dates.AddRange(periods.Periods.Select(p => ToQl(p.End)));
        var regular = periods.Periods.Select(p => p.IsRegular).ToList();
        var schedule = new QL.Schedule(
            dates,
            new QL.NullCalendar(),
            QL.BusinessDayConvention.Unadjusted,
            QL.BusinessDayConvention.Unadjusted,
            new QL.Period(Frequency(bond.Frequency)),
            QL.DateGeneration.Rule.Backward,
            false,
            regular);
        return new QL.FixedRateBond(
            0,
            100.0,
            schedule,
            [(double)bond.CouponRate],
            dayCounter,
            QL.BusinessDayConvention.Unadjusted,
            100.0,
            ToQl(bond.IssueDate),
            new QL.NullCalendar());
    }
}
