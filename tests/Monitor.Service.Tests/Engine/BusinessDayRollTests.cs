using Monitor.Service.Engine;

namespace Monitor.Service.Tests.Engine;

/// <summary>
/// The business date of a moment under a configured roll (issue 10, "Business days, not UTC dates"). Zone rules from
/// the IANA tz database (America/New_York: EDT UTC-4 from 8 March 2026, EST UTC-5 from 1 November 2026;
/// Europe/London: BST UTC+1 in summer). The naming of a day (evening rolls name the next date) is common practice, no source.
/// </summary>
public class BusinessDayRollTests
{
    private static readonly TimeZoneInfo NewYork = TimeZoneInfo.FindSystemTimeZoneById("America/New_York");
    private static readonly TimeZoneInfo London = TimeZoneInfo.FindSystemTimeZoneById("Europe/London");

    private static DateTimeOffset Utc(int month, int day, int hour, int minute = 0) => new(2026, month, day, hour, minute, 0, TimeSpan.Zero);

    [Fact]
    public void Midnight_utc_gives_utc_dates()
    {
        Assert.Equal(new DateOnly(2026, 6, 1), BusinessDayRoll.UtcMidnight.BusinessDateOf(Utc(6, 1, 23, 59)));
        Assert.Equal(new DateOnly(2026, 6, 2), BusinessDayRoll.UtcMidnight.BusinessDateOf(Utc(6, 2, 0)));
    }

    [Fact]
    public void An_evening_roll_puts_the_evening_into_the_next_business_day()
    {
        var roll = new BusinessDayRoll(new TimeOnly(17, 0), NewYork);
        Assert.Equal(new DateOnly(2026, 6, 1), roll.BusinessDateOf(Utc(6, 1, 20, 59))); // 16:59 EDT
        Assert.Equal(new DateOnly(2026, 6, 2), roll.BusinessDateOf(Utc(6, 1, 21, 0)));  // 17:00 EDT
        Assert.Equal(Utc(6, 1, 21, 0), roll.EndOf(new DateOnly(2026, 6, 1)));
    }

    [Fact]
    public void A_small_hours_roll_keeps_the_night_in_the_day_before()
    {
        var roll = new BusinessDayRoll(new TimeOnly(2, 0), London);
        Assert.Equal(new DateOnly(2026, 6, 1), roll.BusinessDateOf(Utc(6, 2, 0, 30))); // 01:30 BST
        Assert.Equal(new DateOnly(2026, 6, 2), roll.BusinessDateOf(Utc(6, 2, 1, 0)));  // 02:00 BST
    }

    [Fact]
    public void A_roll_the_clocks_skip_happens_when_they_jump()
    {
        // 8 March 2026 in New York: 02:00 EST jumps to 03:00 EDT (07:00Z); 02:30 does not exist that night.
        var roll = new BusinessDayRoll(new TimeOnly(2, 30), NewYork);
        Assert.Equal(Utc(3, 8, 7, 0), roll.EndOf(new DateOnly(2026, 3, 7)));
        Assert.Equal(new DateOnly(2026, 3, 7), roll.BusinessDateOf(Utc(3, 8, 6, 59)));
        Assert.Equal(new DateOnly(2026, 3, 8), roll.BusinessDateOf(Utc(3, 8, 7, 0)));
    }

    [Fact]
    public void A_roll_the_clocks_repeat_happens_once_at_its_first_occurrence()
    {
        // 1 November 2026 in New York: 01:30 EDT (05:30Z), then again 01:30 EST (06:30Z) after the clocks fall back.
        var roll = new BusinessDayRoll(new TimeOnly(1, 30), NewYork);
        Assert.Equal(Utc(11, 1, 5, 30), roll.EndOf(new DateOnly(2026, 10, 31)));
        Assert.Equal(new DateOnly(2026, 11, 1), roll.BusinessDateOf(Utc(11, 1, 6, 10))); // 01:10 EST, the repeated hour
    }

    [Theory]
    [InlineData(0, 0, "America/New_York")]
    [InlineData(1, 30, "America/New_York")]
    [InlineData(2, 30, "America/New_York")]
    [InlineData(17, 0, "America/New_York")]
    [InlineData(1, 0, "Europe/London")]
    [InlineData(23, 45, "Asia/Kolkata")]
    public void Business_dates_never_run_backwards_and_change_only_at_a_roll(int hour, int minute, string zone)
    {
        var roll = new BusinessDayRoll(new TimeOnly(hour, minute), TimeZoneInfo.FindSystemTimeZoneById(zone));
        // Through both 2026 daylight-saving changes of New York and London, in 7-minute steps.
        foreach (var start in new[] { Utc(3, 6, 0), Utc(3, 27, 0), Utc(10, 23, 0), Utc(10, 30, 0) })
        {
            var previous = roll.BusinessDateOf(start);
            for (var t = start; t < start.AddDays(4); t = t.AddMinutes(7))
            {
                var date = roll.BusinessDateOf(t);
                Assert.True(date >= previous, $"{t:O}: {date} after {previous}");
                Assert.True(date == previous || (date == previous.AddDays(1) && t >= roll.EndOf(previous) && t.AddMinutes(-7) < roll.EndOf(previous)),
                    $"{t:O}: {previous} -> {date} but the roll is at {roll.EndOf(previous):O}");
                Assert.True(t < roll.NextRollAfter(t));
                previous = date;
            }
        }
    }
}
