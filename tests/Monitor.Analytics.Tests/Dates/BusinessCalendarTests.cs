using Monitor.Analytics.Dates;
using static Monitor.Analytics.Tests.Support.D;

namespace Monitor.Analytics.Tests.Dates;

public class BusinessCalendarTests
{
    // An invented holiday list (no real market calendar): Mon 25 Dec 2023, Tue 26 Dec 2023, Mon 1 Jan 2024.
    private static readonly BusinessCalendar Calendar = new("TEST", [Ymd(2023, 12, 25), Ymd(2023, 12, 26), Ymd(2024, 1, 1)]);

    [Fact]
    public void Weekends_and_holidays_are_not_business_days()
    {
        // Calendar facts: 23/24 Dec 2023 are Saturday/Sunday (common practice, no source needed beyond the calendar).
        Assert.False(Calendar.IsBusinessDay(Ymd(2023, 12, 23)));
        Assert.False(Calendar.IsBusinessDay(Ymd(2023, 12, 24)));
        Assert.False(Calendar.IsBusinessDay(Ymd(2023, 12, 25)));
        Assert.True(Calendar.IsBusinessDay(Ymd(2023, 12, 22)));
        Assert.True(Calendar.IsBusinessDay(Ymd(2023, 12, 27)));
    }

    [Fact]
    public void Next_business_day_skips_weekend_and_holidays()
    {
        Assert.Equal(Ymd(2023, 12, 27), Calendar.NextBusinessDay(Ymd(2023, 12, 22)));
        Assert.Equal(Ymd(2024, 1, 2), Calendar.NextBusinessDay(Ymd(2023, 12, 29)));
    }

    [Theory]
    // T+1 from Friday 22 Dec 2023 skips the weekend and two holidays.
    [InlineData(2023, 12, 22, 1, 2023, 12, 27)]
    [InlineData(2023, 12, 22, 2, 2023, 12, 28)]
    // T+0 on a business day is the trade date.
    [InlineData(2023, 12, 21, 0, 2023, 12, 21)]
    // Trade on a Saturday: rolled to the next business day first, then T+1 (common practice, no source).
    [InlineData(2023, 12, 30, 1, 2024, 1, 3)]
    // T+2 across New Year.
    [InlineData(2023, 12, 28, 2, 2024, 1, 2)]
    public void Settlement_date_counts_business_days(int ty, int tm, int td, int lag, int sy, int sm, int sd)
    {
        Assert.Equal(Ymd(sy, sm, sd), Calendar.SettlementDate(Ymd(ty, tm, td), lag));
    }

    [Fact]
    public void Adding_negative_business_days_goes_back()
    {
        Assert.Equal(Ymd(2023, 12, 22), Calendar.AddBusinessDays(Ymd(2023, 12, 27), -1));
        Assert.Equal(Ymd(2023, 12, 22), BusinessCalendar.WeekendsOnly.AddBusinessDays(Ymd(2023, 12, 25), -1));
    }

    [Fact]
    public void Negative_settlement_lag_is_rejected_naming_the_value()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Calendar.SettlementDate(Ymd(2023, 12, 22), -1));
        Assert.Contains("lagBusinessDays = -1", ex.Message, StringComparison.Ordinal);
    }
}
