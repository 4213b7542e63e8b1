using FsCheck;
using FsCheck.Fluent;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Pricing;
using Monitor.Analytics.Tests.Support;
using static Monitor.Analytics.Tests.Support.D;

namespace Monitor.Analytics.Tests.Pricing;

public class BondYieldTests
{
    private static readonly Bond TenYear = TestBonds.Fixed(0.04m, Ymd(2022, 2, 15), Ymd(2032, 2, 15));
    private static readonly DateOnly Settlement = Ymd(2024, 5, 7);

    [Fact]
    public void Par_bond_on_a_coupon_date_prices_at_par()
    {
        // A bond whose yield equals its coupon prices at 100 on a coupon date (definition of par yield; any text).
        Assert.Equal(100.0, BondYield.CleanPrice(TenYear, Ymd(2024, 2, 15), 0.04), 10);
        foreach (var dc in Enum.GetValues<DayCountConvention>())
        {
            var bond = TestBonds.Fixed(0.05m, Ymd(2022, 3, 31), Ymd(2027, 3, 31), 4, dc);
            Assert.Equal(100.0, BondYield.CleanPrice(bond, Ymd(2023, 9, 30), 0.05), 10);
        }
    }

    [Fact]
    public void Textbook_twenty_year_bond_price_and_modified_duration()
    {
        // F. J. Fabozzi, Bond Markets, Analysis, and Strategies, chapter on measuring interest-rate risk: a 9% 20-year
        // semiannual bond priced to yield 6% costs 134.6722 and has modified duration 10.66. From memory: edition and
        // page not checked. Settled on a coupon date, so no stub.
        var bond = TestBonds.Fixed(0.09m, Ymd(2004, 3, 1), Ymd(2024, 3, 1));
        var m = BondYield.Measures(bond, Ymd(2004, 3, 1), 0.06);
        Assert.Equal(134.6722, m.CleanPrice, 4);
        Assert.Equal(10.66, m.ModifiedDuration, 2);
        Assert.Equal(m.ModifiedDuration * 1.03, m.MacaulayDuration, 12);
    }

    [Fact]
    public void Street_equals_compounded_while_two_or_more_flows_remain()
    {
        // Street convention only departs from compounding in the final period (SIA; see YieldConvention.Street).
        for (var settlement = Ymd(2022, 2, 15); settlement < Ymd(2031, 8, 15); settlement = settlement.AddDays(37))
        {
            var street = BondYield.Measures(TenYear, settlement, 0.037);
            var compounded = BondYield.Measures(TenYear, settlement, 0.037, YieldConvention.Compounded);
            Assert.Equal(compounded, street);
        }

        var last = Ymd(2031, 9, 1);
        Assert.NotEqual(
            BondYield.DirtyPrice(TenYear, last, 0.037, YieldConvention.Compounded),
            BondYield.DirtyPrice(TenYear, last, 0.037));
    }

    [Fact]
    public void Clean_plus_accrued_is_dirty()
    {
        var m = BondYield.Measures(TenYear, Settlement, 0.045);
        Assert.Equal(m.DirtyPrice, m.CleanPrice + m.AccruedInterest, 12);
        Assert.Equal(TenYear.AccruedInterest(Settlement), m.AccruedInterest, 12);
        Assert.Equal(BondYield.DirtyPrice(TenYear, Settlement, 0.045), m.DirtyPrice, 12);
    }

    [Fact]
    public void Measures_agree_with_finite_differences_of_the_price()
    {
        // Definitions (domain primer): modified = -(1/P) dP/dy, convexity = (1/P) d2P/dy2, DV01 = P(y - 1bp) - P(y),
        // and Macaulay = modified x (1 + y/f) when every flow is compounded. Central differences, h = 1e-5:
        // truncation error ~h^2, rounding ~1e-16 x 100 / h^2 for the second difference, hence 1e-6 / 1e-3 tolerances.
        foreach (var convention in Enum.GetValues<YieldConvention>())
        {
            const double y = 0.045;
            const double h = 1e-5;
            var m = BondYield.Measures(TenYear, Settlement, y, convention);
            var up = BondYield.DirtyPrice(TenYear, Settlement, y + h, convention);
            var down = BondYield.DirtyPrice(TenYear, Settlement, y - h, convention);
            Assert.Equal(-(up - down) / (2 * h) / m.DirtyPrice, m.ModifiedDuration, 6);
            Assert.Equal((up + down - (2 * m.DirtyPrice)) / (h * h) / m.DirtyPrice, m.Convexity, 3);
            Assert.Equal(BondYield.DirtyPrice(TenYear, Settlement, y - 1e-4, convention) - m.DirtyPrice, m.Dv01, 12);
            if (convention != YieldConvention.TreasuryAuction)
            {
                Assert.Equal(m.MacaulayDuration / (1 + (y / 2)), m.ModifiedDuration, 12);
            }
        }
    }

    [Fact]
    public void Yield_round_trips_through_price_for_random_bonds()
    {
        // Property: FromCleanPrice(CleanPrice(y)) = y (inverse functions), over random bonds and yields.
        var gen =
            from years in Gen.Choose(1, 40)
            from freqIndex in Gen.Choose(0, 3)
            from dcIndex in Gen.Choose(0, 5)
            from couponBp in Gen.Choose(0, 1500)
            from yieldBp in Gen.Choose(-200, 3000)
            from settleDays in Gen.Choose(0, 364)
            select (years, freqIndex, dcIndex, couponBp, yieldBp, settleDays);
        Prop.ForAll(gen.ToArbitrary(), c =>
        {
            int[] freqs = [1, 2, 4, 12];
            var issue = Ymd(2020, 1, 20);
            var bond = TestBonds.Fixed(c.couponBp / 10_000m, issue, issue.AddYears(c.years), freqs[c.freqIndex], (DayCountConvention)c.dcIndex);
            var settlement = issue.AddDays(c.settleDays);
            if (settlement >= bond.MaturityDate)
            {
                return true;
            }

            var y = c.yieldBp / 10_000.0;
            return Math.Abs(BondYield.FromCleanPrice(bond, settlement, BondYield.CleanPrice(bond, settlement, y)) - y) < 1e-9;
        }).QuickCheckThrowOnFailure();
    }

    [Fact]
    public void Deep_discount_falls_back_to_the_bracketing_solver()
    {
        // A 2% 30-year bond at 3 per 100: Newton from the coupon overshoots; Brent must still find the root.
        var bond = TestBonds.Fixed(0.02m, Ymd(2020, 1, 15), Ymd(2050, 1, 15));
        var y = BondYield.FromCleanPrice(bond, Ymd(2021, 3, 3), 3.0);
        Assert.Equal(3.0, BondYield.CleanPrice(bond, Ymd(2021, 3, 3), y), 8);
        Assert.True(y > 0.3);
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(-5.0)]
    [InlineData(0.0)]
    [InlineData(20_000.0)]
    public void Absurd_prices_are_rejected_naming_the_value(double price)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => BondYield.FromCleanPrice(TenYear, Settlement, price));
        Assert.Contains("cleanPrice = ", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_price_no_yield_in_range_can_reach_is_rejected()
    {
        // 5000 per 100 for a 4% bond with under eight years left would need a yield far below -25%.
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => BondYield.FromCleanPrice(TenYear, Settlement, 5000.0));
        Assert.Contains("cleanPrice = 5000", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(-0.9)]
    [InlineData(7.0)]
    public void Absurd_yields_are_rejected_naming_the_value(double yield)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => BondYield.CleanPrice(TenYear, Settlement, yield));
        Assert.Contains("yield = ", ex.Message, StringComparison.Ordinal);
    }
}
