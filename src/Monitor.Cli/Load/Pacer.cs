namespace Monitor.Cli.Load;

/// <summary>
/// Open-loop pacing: message i is due at i / rate seconds after the start, whatever happened to earlier sends, so a
/// slow send is followed by a catch-up rather than a permanently lower rate (no coordinated omission in the schedule).
/// </summary>
internal sealed class Pacer
{
    public Pacer(double ratePerSecond)
    {
        if (!(ratePerSecond > 0) || double.IsInfinity(ratePerSecond))
        {
            throw new ArgumentOutOfRangeException(nameof(ratePerSecond), ratePerSecond, $"rate {ratePerSecond} must be a positive finite number of messages per second.");
        }
        RatePerSecond = ratePerSecond;
    }

    public double RatePerSecond { get; }

    /// <summary>Time after the start at which message <paramref name="index"/> (0-based) is due.</summary>
    public TimeSpan DueAt(long index) => TimeSpan.FromSeconds(index / RatePerSecond);

    /// <summary>How long to wait before sending message <paramref name="index"/> when <paramref name="elapsed"/> has passed since the start; zero when it is already due.</summary>
    public TimeSpan DelayBefore(long index, TimeSpan elapsed)
    {
        var wait = DueAt(index) - elapsed;
        return wait > TimeSpan.Zero ? wait : TimeSpan.Zero;
    }

    /// <summary>Messages in a paced run of <paramref name="seconds"/> seconds: rate x seconds, rounded down.</summary>
    public long CountFor(double seconds) => (long)Math.Floor(RatePerSecond * seconds);
}
