using System.Diagnostics;

namespace Monitor.Cli.Demo;

/// <summary>
/// The demo's clock: simulated time runs <see cref="Rate"/> times faster than real time from <see cref="Start"/> once
/// <see cref="Run"/> is called (it stands still at <see cref="Start"/> before). Registered as the service's
/// <see cref="TimeProvider"/>, so quote ages, log timestamps and the business day follow the simulated day. Timers
/// and delays stay in real time (the base class's), so the conflation window is real milliseconds.
/// </summary>
internal sealed class SimulatedClock(DateTimeOffset start, double rate) : TimeProvider
{
    private long _startedAt;

    public DateTimeOffset Start { get; } = start;

    /// <summary>Simulated seconds per real second.</summary>
    public double Rate { get; } = rate > 0 ? rate : throw new ArgumentOutOfRangeException(nameof(rate), rate, "rate must be positive.");

    public void Run() => Interlocked.CompareExchange(ref _startedAt, Stopwatch.GetTimestamp(), 0);

    public override DateTimeOffset GetUtcNow()
    {
        var started = Interlocked.Read(ref _startedAt);
        return started == 0 ? Start : Start + TimeSpan.FromTicks((long)(Stopwatch.GetElapsedTime(started).Ticks * Rate));
    }

    /// <summary>Real time to wait until the simulated clock shows <paramref name="simulated"/>; zero when already past.</summary>
    public TimeSpan RealDelayUntil(DateTimeOffset simulated)
    {
        var ahead = simulated - GetUtcNow();
        return ahead <= TimeSpan.Zero ? TimeSpan.Zero : TimeSpan.FromTicks((long)(ahead.Ticks / Rate));
    }
}
