using System.Threading.Channels;
using Microsoft.Extensions.Time.Testing;

namespace Monitor.Service.Tests.Support;

/// <summary>
/// A <see cref="FakeTimeProvider"/> that reports each timer created on it (Task.Delay creates one): a test waits for the
/// code under test to start waiting before it moves the clock, instead of racing it.
/// </summary>
public sealed class WaitSignallingClock(DateTimeOffset start) : TimeProvider
{
    private readonly FakeTimeProvider _fake = new(start);
    private readonly Channel<TimeSpan> _waits = Channel.CreateUnbounded<TimeSpan>();

    public override DateTimeOffset GetUtcNow() => _fake.GetUtcNow();

    public override long GetTimestamp() => _fake.GetTimestamp();

    public override long TimestampFrequency => _fake.TimestampFrequency;

    public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period)
    {
        var timer = _fake.CreateTimer(callback, state, dueTime, period);
        _waits.Writer.TryWrite(dueTime);
        return timer;
    }

    public void Advance(TimeSpan by) => _fake.Advance(by);

    /// <summary>Waits (30 s at most, a safety net against a hang) until the next timer is created; returns its due time.</summary>
    public async Task<TimeSpan> NextWaitAsync() => await _waits.Reader.ReadAsync().AsTask().WaitAsync(TimeSpan.FromSeconds(30));
}
