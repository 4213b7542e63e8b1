using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Pricing;
using Monitor.Analytics.Tests.Oracle;
using Xunit.Abstractions;
using QL = QLNet;

namespace Monitor.Analytics.Tests.Pricing;

/// <summary>
/// Random bonds checked against QLNet 1.13.2 (reference library): accrued interest (BondFunctions.accruedAmount),
/// dirty price and yield (BondFunctions.dirtyPrice / yield with Compounding.Compounded at the coupon frequency),
/// Macaulay and modified duration (BondFunctions.duration) and convexity (BondFunctions.convexity).
/// Our side uses <see cref="YieldConvention.Compounded"/>, QLNet's convention (no simple-interest final period).
///
/// Known convention differences, and how the comparison deals with them:
/// - Coupon size. QLNet pays rate x accrual-day-count fraction every period; we pay C/f in regular periods (31 CFR 356
///   App. B, I.A.1). These agree for ACT/ACT ICMA and, away from 31st/February month ends, 30/360; so dates use days
///   1-28. For ACT/ACT ISDA, ACT/360 and ACT/365F they differ, so price, yield and durations of those bonds are
///   compared with a QLNet twin accruing ACT/ACT ICMA (same C/f coupons; our yield time grid is the ICMA fraction for
///   actual-day conventions), for regular schedules only; accrued is always compared with the bond's own day count.
/// - 30/360 stub: QLNet measures the stub as YF(start, next) - YF(start, settlement), we as YF(settlement, next);
///   equal unless the settlement day is the 31st, so 30/360 settlements avoid the 31st.
/// - Zero-coupon bonds are left out: QLNet fakes a one-year reference period for a lone redemption flow.
/// </summary>
public class QLNetComparisonTests(ITestOutputHelper output)
{
    private const int Cases = 400;

    [Fact]
    public void Random_bonds_agree_with_QLNet()
    {
        var random = new Random(20261201);
        int priced = 0, accruedOnly = 0, oddFirst = 0, longFirst = 0;
        double worstYield = 0, worstAccrued = 0, worstDuration = 0, worstConvexity = 0;
        for (var i = 0; i < Cases; i++)
        {
            var (bond, settlement, y) = RandomCase(random, i);
            var frequency = QLNetBondOracle.Frequency(bond.Frequency);
            var ownDc = QLNetBondOracle.DayCounter(bond.DayCount);
            var qlOwn = QLNetBondOracle.Build(bond, ownDc);
            var qlSettlement = QLNetBondOracle.ToQl(settlement);
            var label = $"case {i}: {bond} issue {bond.IssueDate:yyyy-MM-dd} first {bond.FirstCouponDate:yyyy-MM-dd} settle {settlement:yyyy-MM-dd} y {y}";

            // Accrued per 100: QLNet BondFunctions.accruedAmount; tolerance 1e-8 (per 100 face).
            var accrued = bond.AccruedInterest(settlement);
            var qlAccrued = QL.BondFunctions.accruedAmount(qlOwn, qlSettlement);
            Assert.True(Math.Abs(accrued - qlAccrued) < 1e-8, $"{label}: accrued {accrued} vs QLNet {qlAccrued}");
            worstAccrued = Math.Max(worstAccrued, Math.Abs(accrued - qlAccrued));

            var actualDays = bond.DayCount is DayCountConvention.ActActIsda or DayCountConvention.Act360 or DayCountConvention.Act365Fixed;
            var regular = bond.Schedule!.Periods.All(p => p.IsRegular);
            if (actualDays && !regular)
            {
                accruedOnly++;
                continue;
            }

            var yieldDc = actualDays ? QLNetBondOracle.DayCounter(DayCountConvention.ActActIcma) : ownDc;
            var ql = actualDays ? QLNetBondOracle.Build(bond, yieldDc) : qlOwn;
            var m = BondYield.Measures(bond, settlement, y, YieldConvention.Compounded);

            // Dirty price at the same yield: QLNet BondFunctions.dirtyPrice; tolerance 1e-9 relative.
            var qlDirty = QL.BondFunctions.dirtyPrice(ql, y, yieldDc, QL.Compounding.Compounded, frequency, qlSettlement);
            Assert.True(Math.Abs(m.DirtyPrice - qlDirty) < 1e-9 * qlDirty, $"{label}: dirty {m.DirtyPrice} vs QLNet {qlDirty}");

            // Yield from price: QLNet BondFunctions.yield on the clean price QLNet's own accrued implies; tolerance 1e-7
            // (QLNet's solver accuracy is set to 1e-12, ours converges to 1e-12).
            var qlClean = m.DirtyPrice - QL.BondFunctions.accruedAmount(ql, qlSettlement);
            var qlYield = QL.BondFunctions.yield(ql, qlClean, yieldDc, QL.Compounding.Compounded, frequency, qlSettlement, 1e-12, 200);
            var ourYield = BondYield.FromCleanPrice(bond, settlement, m.CleanPrice, YieldConvention.Compounded);
            Assert.True(Math.Abs(qlYield - y) < 1e-7, $"{label}: QLNet yield {qlYield}");
            Assert.True(Math.Abs(ourYield - qlYield) < 1e-7, $"{label}: yield {ourYield} vs QLNet {qlYield}");
            worstYield = Math.Max(worstYield, Math.Abs(ourYield - qlYield));

            // Durations and convexity: QLNet BondFunctions.duration (Macaulay, Modified) and convexity; 1e-6 relative.
            var qlMac = QL.BondFunctions.duration(ql, y, yieldDc, QL.Compounding.Compounded, frequency, QL.Duration.Type.Macaulay, qlSettlement);
            var qlMod = QL.BondFunctions.duration(ql, y, yieldDc, QL.Compounding.Compounded, frequency, QL.Duration.Type.Modified, qlSettlement);
            var qlConv = QL.BondFunctions.convexity(ql, y, yieldDc, QL.Compounding.Compounded, frequency, qlSettlement);
            AssertRelative(qlMac, m.MacaulayDuration, 1e-6, $"{label}: Macaulay");
            AssertRelative(qlMod, m.ModifiedDuration, 1e-6, $"{label}: modified");
            AssertRelative(qlConv, m.Convexity, 1e-6, $"{label}: convexity");
            worstDuration = Math.Max(worstDuration, Math.Max(Math.Abs(qlMac / m.MacaulayDuration - 1), Math.Abs(qlMod / m.ModifiedDuration - 1)));
            worstConvexity = Math.Max(worstConvexity, Math.Abs(qlConv / m.Convexity - 1));
            priced++;
            if (!regular)
            {
                oddFirst++;
                if (bond.FirstCouponDate is not null && !bond.Schedule.Periods[0].IsRegular && bond.Schedule.Periods[0].ReferenceStart > bond.IssueDate)
                {
                    longFirst++;
                }
            }
        }

        output.WriteLine($"priced {priced} (odd periods {oddFirst}, long first {longFirst}), accrued only {accruedOnly}");
        output.WriteLine($"worst |dy| {worstYield:E2}, worst accrued {worstAccrued:E2}, worst duration rel {worstDuration:E2}, worst convexity rel {worstConvexity:E2}");
        Assert.True(priced >= 200, $"only {priced} bonds priced against QLNet");
        Assert.True(longFirst >= 20, $"only {longFirst} long first periods");
    }

    private static void AssertRelative(double expected, double actual, double tolerance, string label) =>
        Assert.True(Math.Abs(actual - expected) <= tolerance * Math.Abs(expected), $"{label} {actual} vs QLNet {expected}");

    private static (Bond Bond, DateOnly Settlement, double Yield) RandomCase(Random random, int i)
    {
        int[] frequencies = [1, 2, 4, 12];
        var frequency = frequencies[random.Next(frequencies.Length)];
        var dayCount = (DayCountConvention)random.Next(6);
        var months = 12 / frequency;
        var maturity = new DateOnly(random.Next(2027, 2061), random.Next(1, 13), random.Next(1, 29));
        var periods = random.Next(1, Math.Min(30 * frequency, 120) + 1);
        var regularStart = maturity.AddMonths(-periods * months);
        DateOnly issue;
        DateOnly? firstCoupon = null;
        switch (random.Next(4))
        {
            case 0:
                // Regular schedule: issued on cycle.
                issue = regularStart;
                break;
            case 1:
                // Short first period generated backward from maturity.
                issue = regularStart.AddDays(random.Next(1, (months * 28) - 1));
                break;
            case 2:
                // Long first period: first coupon one regular date after the start, issue up to a period earlier.
                firstCoupon = regularStart.AddMonths(months);
                issue = regularStart.AddDays(-random.Next(1, months * 28));
                if (firstCoupon >= maturity)
                {
                    firstCoupon = null;
                }

                break;
            default:
                // Explicit short first coupon.
                firstCoupon = regularStart.AddMonths(months);
                issue = regularStart.AddDays(random.Next(1, months * 28));
                if (firstCoupon >= maturity)
                {
                    firstCoupon = null;
                }

                break;
        }

        var coupon = random.Next(0, 1201) / 10_000m;
        var bond = new Bond($"Q{i}", "Test Issuer", null, "USD", coupon, frequency, dayCount, issue, firstCoupon, maturity);
        DateOnly settlement;
        do
        {
            settlement = issue.AddDays(random.Next(0, maturity.DayNumber - issue.DayNumber));
        }
        while (settlement.Day == 31 && dayCount is DayCountConvention.Thirty360BondBasis or DayCountConvention.Thirty360European);

        var y = random.Next(-50, 1501) / 10_000.0;
        return (bond, settlement, y);
    }
}
