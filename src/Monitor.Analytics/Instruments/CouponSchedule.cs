using Monitor.Analytics.Dates;

namespace Monitor.Analytics.Instruments;

/// <summary>
/// Unadjusted coupon periods of a fixed-coupon bond. Dates are generated backward from maturity in steps of
/// 12/frequency months, or, when a first coupon date is given, forward from it (an odd, short last period is
/// then possible). End-of-month rule: if the anchor (maturity, or the first coupon date when generating
/// forward) is the last day of a month, every coupon date is a month end (common practice, e.g. US Treasury
/// notes maturing 31 Aug pay on 28/29 Feb; 31 CFR 356 App. B, Table 1 "last days of the months").
/// The first period runs from the issue date and may be short or long (odd first period).
/// </summary>
public sealed class CouponSchedule
{
    private CouponSchedule(IReadOnlyList<CouponPeriod> periods) => Periods = periods;

    public IReadOnlyList<CouponPeriod> Periods { get; }

    /// <summary>Coupon payment dates (period ends), the last one being maturity.</summary>
    public IEnumerable<DateOnly> CouponDates => Periods.Select(p => p.End);

    /// <summary>Builds the schedule; inputs must already be validated (see <see cref="Bond"/>).</summary>
    public static CouponSchedule Generate(DateOnly issueDate, DateOnly? firstCouponDate, DateOnly maturityDate, int frequency)
    {
        var months = CouponFrequency.MonthsPerPeriod(frequency);
        var periods = new List<CouponPeriod>();

        if (firstCouponDate is not { } first)
        {
            var eom = DateRules.IsEndOfMonth(maturityDate);
            var dates = new List<DateOnly> { maturityDate };
            for (var k = 1; ; k++)
            {
                var d = DateRules.AddMonths(maturityDate, -k * months, eom);
                if (d <= issueDate)
                {
                    break;
                }

                dates.Add(d);
            }

            dates.Reverse();

            // First period: issue -> dates[0]; its reference period is the regular period ending there.
            var firstRefStart = DateRules.AddMonths(maturityDate, -dates.Count * months, eom);
            periods.Add(new CouponPeriod(issueDate, dates[0], firstRefStart, dates[0], firstRefStart == issueDate));
            for (var i = 1; i < dates.Count; i++)
            {
                periods.Add(new CouponPeriod(dates[i - 1], dates[i], dates[i - 1], dates[i], true));
            }
        }
        else
        {
            var eom = DateRules.IsEndOfMonth(first) && DateRules.IsEndOfMonth(maturityDate);
            var firstRefStart = DateRules.AddMonths(first, -months, eom);
            periods.Add(new CouponPeriod(issueDate, first, firstRefStart, first, firstRefStart == issueDate));
            var previous = first;
            for (var k = 1; previous < maturityDate; k++)
            {
                var regular = DateRules.AddMonths(first, k * months, eom);
                if (regular >= maturityDate)
                {
                    // Last period: regular if it lands on maturity, otherwise a short odd last period whose
                    // reference period starts at the previous coupon date.
                    periods.Add(new CouponPeriod(previous, maturityDate, previous, regular, regular == maturityDate));
                    break;
                }

                periods.Add(new CouponPeriod(previous, regular, previous, regular, true));
                previous = regular;
            }
        }

        return new CouponSchedule(periods);
    }

    /// <summary>
    /// Index of the period that holds <paramref name="date"/> for accrual: Start &lt;= date &lt; End. -1 when the
    /// date is before the first period starts or on/after maturity.
    /// </summary>
    public int PeriodIndexContaining(DateOnly date)
    {
        if (Periods.Count == 0 || date < Periods[0].Start || date >= Periods[^1].End)
        {
            return -1;
        }

        var lo = 0;
        var hi = Periods.Count - 1;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            if (Periods[mid].End <= date)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }
}
