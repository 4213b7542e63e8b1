using System.Diagnostics;
using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Load;

/// <summary>Hands the service's outbound events to the <see cref="LatencyTracker"/> of the phase running (read through <paramref name="tracker"/>), stamped on receipt.</summary>
internal sealed class LoadEventConsumer(Func<LatencyTracker?> tracker) : IConsumer<CurveFitted>, IConsumer<LimitStatusChanged>, IConsumer<BookExposuresBatch>
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

    public Task Consume(ConsumeContext<BookExposuresBatch> context)
    {
        var received = Stopwatch.GetTimestamp();
        foreach (var book in context.Message.Books)
        {
            tracker()?.OnBookUpdated(book.CauseMessageId, received);
        }
        return Task.CompletedTask;
    }
}
