using Monitor.Cli.Demo;

namespace Monitor.Cli.Tests.Demo;

/// <summary>The demo clock maps simulated time to real waits (our own design; no source).</summary>
public sealed class SimulatedClockTests
{
    private static readonly DateTimeOffset Start = new(2026, 6, 1, 8, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Before_it_runs_the_clock_stands_at_the_start() =>
        Assert.Equal(Start, new SimulatedClock(Start, 540).GetUtcNow());

    [Fact]
    public void A_simulated_hour_at_540_times_real_speed_is_a_real_wait_of_6_2_3_seconds()
    {
        var clock = new SimulatedClock(Start, 540);

        var wait = clock.RealDelayUntil(Start.AddHours(1));

        // 3600 s / 540 = 6.667 s
        Assert.Equal(3600.0 / 540.0, wait.TotalSeconds, 6);
        Assert.Equal(TimeSpan.Zero, clock.RealDelayUntil(Start.AddHours(-1)));
    }

    [Fact]
    public void A_rate_that_is_not_positive_is_refused() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new SimulatedClock(Start, 0));
}
