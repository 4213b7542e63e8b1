using System.Diagnostics;
using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Load;

/// <summary>
/// Counts the <see cref="BondQuoted"/> messages a bus has finished consuming (after its consumers ran), with the
/// <see cref="Stopwatch"/> time of the last one; hands each consumed message id to <see cref="Consumed"/> (the bare
/// consumer's latency).
/// </summary>
internal sealed class ConsumptionCounter : IConsumeMessageObserver<BondQuoted>
{
    private long _count;
    private long _last;
    private long _faults;

    public event Action<Guid, long>? Consumed;

    public long Count => Interlocked.Read(ref _count);

    public long Faults => Interlocked.Read(ref _faults);

    /// <summary><see cref="Stopwatch.GetTimestamp"/> when the last message was consumed.</summary>
    public long LastTimestamp => Interlocked.Read(ref _last);

    public Task PreConsume(ConsumeContext<BondQuoted> context) => Task.CompletedTask;

    public Task PostConsume(ConsumeContext<BondQuoted> context)
    {
        ArgumentNullException.ThrowIfNull(context);
        var now = Stopwatch.GetTimestamp();
        Interlocked.Exchange(ref _last, now);
        Interlocked.Increment(ref _count);
        if (context.MessageId is { } id)
        {
            Consumed?.Invoke(id, now);
        }
        return Task.CompletedTask;
    }

    public Task ConsumeFault(ConsumeContext<BondQuoted> context, Exception exception)
    {
        Interlocked.Increment(ref _faults);
        return Task.CompletedTask;
    }
}
