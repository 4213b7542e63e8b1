using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Tests.Support;
using static Monitor.Analytics.Tests.Support.D;

namespace Monitor.Analytics.Tests.Instruments;

public class CouponScheduleTests
{
    [Fact]
    public void End_of_month_maturity_makes_every_coupon_a_month_end()
    {
        // End-of-month rule: 31 CFR 356 App. B, I, Table 1 lists half-years between "last days of the months"
        // (e.g. 29 Feb to 31 Aug in a leap year).
        var bond = TestBonds.Fixed(0.04m, Ymd(2023, 8, 31), Ymd(2026, 8, 31));
        var dates = bond.Schedule!.CouponDates.ToList();
        Assert.Equal(
            [Ymd(2024, 2, 29), Ymd(2024, 8, 31), Ymd(2025, 2, 28), Ymd(2025, 8, 31), Ymd(2026, 2, 28), Ymd(2026, 8, 31)],
            dates);
        Assert.All(bond.Schedule.Periods, p => Assert.True(p.IsRegular));
    }

    [Fact]
    public void Short_first_period_generated_backward_from_maturity()
    {
        var bond = TestBonds.Fixed(0.06m, Ymd(2024, 3, 10), Ymd(2027, 6, 15));
        var first = bond.Schedule!.Periods[0];
        Assert.Equal(new CouponPeriod(Ymd(2024, 3, 10), Ymd(2024, 6, 15), Ymd(2023, 12, 15), Ymd(2024, 6, 15), false), first);
        Assert.Equal(Ymd(2024, 12, 15), bond.Schedule.Periods[1].End);

        // Short first coupon under ACT/ACT ICMA: C/2 x 97 / 183 days (ICMA Rule 251; ISDA memo 1999 short first period).
        Assert.Equal(3.0 * 97 / 183, bond.CouponAmount(first), 12);
    }

    [Fact]
    public void Long_first_period_accrues_by_quasi_coupon_periods()
    {
        // Issue 10 Jan 2020, first coupon 15 Aug 2020: quasi-coupon date 15 Feb 2020.
        var bond = TestBonds.Fixed(0.05m, Ymd(2020, 1, 10), Ymd(2025, 2, 15), firstCoupon: Ymd(2020, 8, 15));
        var first = bond.Schedule!.Periods[0];
        Assert.False(first.IsRegular);
        Assert.Equal(Ymd(2020, 2, 15), first.ReferenceStart);

        // ICMA Rule 251 / ISDA memo 1999 long first period: accrued 36 days in the 184-day quasi period
        // 15 Aug 2019 - 15 Feb 2020 plus 15 days of the 182-day period 15 Feb - 15 Aug 2020, each over f = 2.
        var expected = 2.5 * ((36.0 / 184) + (15.0 / 182));
        Assert.Equal(expected, bond.AccruedInterest(Ymd(2020, 3, 1)), 12);

        // The long coupon is C/2 x (36 + ... ) : 36/184 of a period before the quasi date plus one full period.
        Assert.Equal(2.5 * ((36.0 / 184) + 1.0), bond.CouponAmount(first), 12);
        Assert.Equal(Ymd(2020, 1, 10), bond.PreviousCouponDate(Ymd(2020, 3, 1)));
        Assert.Equal(Ymd(2020, 8, 15), bond.NextCouponDate(Ymd(2020, 3, 1)));
    }

    [Fact]
    public void Forward_generation_from_first_coupon_can_end_in_a_short_last_period()
    {
        var bond = TestBonds.Fixed(0.05m, Ymd(2020, 1, 10), Ymd(2022, 5, 1), firstCoupon: Ymd(2020, 7, 15));
        var periods = bond.Schedule!.Periods;
        Assert.Equal(Ymd(2022, 1, 15), periods[^2].End);
        Assert.Equal(new CouponPeriod(Ymd(2022, 1, 15), Ymd(2022, 5, 1), Ymd(2022, 1, 15), Ymd(2022, 7, 15), false), periods[^1]);
    }

    [Fact]
    public void Cash_flows_after_settlement_are_strictly_after_it()
    {
        var bond = TestBonds.Fixed(0.05m, Ymd(2020, 1, 15), Ymd(2022, 1, 15));
        var flows = bond.CashFlowsAfter(Ymd(2021, 1, 15));
        Assert.Equal([new CashFlow(Ymd(2021, 7, 15), 2.5), new CashFlow(Ymd(2022, 1, 15), 102.5)], flows);
        Assert.Equal(0.0, bond.AccruedInterest(Ymd(2021, 1, 15)));
    }

    [Fact]
    public void Thirty360_accrued_uses_thirty_day_months()
    {
        // 30/360 Bond Basis (ISDA 2006, 4.16(f)): 15 Jan -> 1 Mar is 46 days; accrued = 100 x 6% x 46/360.
        var bond = TestBonds.Fixed(0.06m, Ymd(2020, 1, 15), Ymd(2025, 1, 15), dayCount: DayCountConvention.Thirty360BondBasis);
        Assert.Equal(6.0 * 46 / 360, bond.AccruedInterest(Ymd(2020, 3, 1)), 12);
    }

    [Fact]
    public void Zero_coupon_bond_pays_only_redemption()
    {
        var bill = new Bond("BILL-1", "Test Treasury", null, "USD", 0m, 0, DayCountConvention.Act365Fixed, Ymd(2024, 1, 4), null, Ymd(2024, 7, 5));
        Assert.True(bill.IsZeroCoupon);
        Assert.Equal([new CashFlow(Ymd(2024, 7, 5), 100.0)], bill.CashFlowsAfter(Ymd(2024, 2, 1)));
        Assert.Equal(0.0, bill.AccruedInterest(Ymd(2024, 2, 1)));
    }
}
