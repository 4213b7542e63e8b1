using Monitor.Cli.Load;

namespace Monitor.Cli.Tests.Load;

/// <summary>Open-loop pacing: message i is due at i / rate (common practice for load generators, no source; it avoids the "coordinated omission" Gil Tene describes for closed-loop testers, from memory).</summary>
public sealed class PacerTests
{
    [Fact]
    public void Message_i_is_due_at_i_over_the_rate()
    {
        var pacer = new Pacer(500);
        Assert.Equal(TimeSpan.Zero, pacer.DueAt(0));
        Assert.Equal(TimeSpan.FromMilliseconds(2), pacer.DueAt(1));
        Assert.Equal(TimeSpan.FromSeconds(20), pacer.DueAt(10_000));
    }

    [Fact]
    public void A_late_sender_does_not_wait_and_an_early_one_waits_for_the_remainder()
    {
        var pacer = new Pacer(100);
        // Message 10 is due at 100 ms.
        Assert.Equal(TimeSpan.FromMilliseconds(40), pacer.DelayBefore(10, TimeSpan.FromMilliseconds(60)));
        Assert.Equal(TimeSpan.Zero, pacer.DelayBefore(10, TimeSpan.FromMilliseconds(100)));
        Assert.Equal(TimeSpan.Zero, pacer.DelayBefore(10, TimeSpan.FromMilliseconds(350)));
    }

    [Fact]
    public void The_schedule_does_not_drift_after_a_stall()
    {
        // After a 1 s stall at 200/s, message 400 is still due at 2 s, not 1 s after the stall's end plus 200 intervals.
        var pacer = new Pacer(200);
        Assert.Equal(TimeSpan.FromSeconds(2), pacer.DueAt(400));
        Assert.Equal(TimeSpan.Zero, pacer.DelayBefore(300, TimeSpan.FromSeconds(2)));
    }

    [Theory]
    [InlineData(500, 20, 10_000)]
    [InlineData(333, 3, 999)]
    [InlineData(0.5, 3, 1)]
    public void A_run_holds_rate_times_seconds_rounded_down(double rate, double seconds, long expected) =>
        Assert.Equal(expected, new Pacer(rate).CountFor(seconds));

    [Theory]
    [InlineData(0)]
    [InlineData(-1)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void A_rate_that_is_not_positive_and_finite_is_refused(double rate)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new Pacer(rate));
        Assert.Contains("rate", ex.Message, StringComparison.Ordinal);
    }
}
