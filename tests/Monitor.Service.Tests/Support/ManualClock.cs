namespace Monitor.Service.Tests.Support;

/// <summary>A clock that can be set to any time, backwards too (FakeTimeProvider only moves forward).</summary>
public sealed class ManualClock(DateTimeOffset now) : TimeProvider
{
    public DateTimeOffset Now { get; set; } = now;

    public override DateTimeOffset GetUtcNow() => Now;
}
