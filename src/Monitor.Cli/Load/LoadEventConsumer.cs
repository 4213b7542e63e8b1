using System.Diagnostics;
using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Load;

/// <summary>Hands the service's outbound events to the <see cref="LatencyTracker"/> of the phase running (read through <paramref name="tracker"/>), stamped on receipt.</summary>
internal sealed class LoadEventConsumer(Func<LatencyTracker?> tracker) : IConsumer<CurveFitted>, IConsumer<LimitStatusChanged>, IConsumer<BookExposuresUpdated>
{
    public Task Consume(ConsumeContext<CurveFitted> context)
    {
        tracker()?.OnCurveFitted(context.Message.CauseMessageId, Stopwatch.GetTimestamp());
        return Task.CompletedTask;
    }

    public Task Consume(ConsumeContext<LimitStatusChanged> context)
    {
        tracker()?.OnStatusChanged(context.Message.CauseMessageId, Stopwatch.GetTimestamp());
        return Task.CompletedTask;
    }

    public Task Consume(ConsumeContext<BookExposuresUpdated> context)
    {
        tracker()?.OnBookUpdated(context.Message.CauseMessageId, Stopwatch.GetTimestamp());
        return Task.CompletedTask;
    }
}
