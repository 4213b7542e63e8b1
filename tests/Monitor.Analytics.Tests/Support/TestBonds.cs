using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Tests.Support;

/// <summary>Invented bonds for tests (no real issuers).</summary>
internal static class TestBonds
{
    public static Bond Fixed(
        decimal coupon,
        DateOnly issue,
        DateOnly maturity,
        int frequency = 2,
        DayCountConvention dayCount = DayCountConvention.ActActIcma,
        DateOnly? firstCoupon = null,
        string id = "TEST-1") =>
        new(id, "Test Treasury", null, "USD", coupon, frequency, dayCount, issue, firstCoupon, maturity);
}
