using System.Collections.Concurrent;
using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Service.Tests.Broker;

/// <summary>Collects the service's outbound events as a downstream subscriber on the broker would see them.</summary>
public sealed class EventRecorder : IConsumer<LimitStatusChanged>, IConsumer<CurveFitted>, IConsumer<BookExposuresBatch>
{
    private readonly RecordedEvents _events;

    public EventRecorder(RecordedEvents events) => _events = events;

    public Task Consume(ConsumeContext<LimitStatusChanged> context)
    {
        _events.StatusChanges.Enqueue(context.Message);
        return Task.CompletedTask;
    }

    public Task Consume(ConsumeContext<CurveFitted> context)
    {
        _events.CurvesFitted.Enqueue(context.Message);
        return Task.CompletedTask;
    }

    public Task Consume(ConsumeContext<BookExposuresBatch> context)
    {
        foreach (var book in context.Message.Books)
        {
            _events.BooksUpdated.Enqueue(book);
        }
        return Task.CompletedTask;
    }
}

/// <summary>What <see cref="EventRecorder"/> received, in arrival order.</summary>
public sealed class RecordedEvents
{
    public ConcurrentQueue<LimitStatusChanged> StatusChanges { get; } = new();

    public ConcurrentQueue<CurveFitted> CurvesFitted { get; } = new();

    /// <summary>The entries of every BookExposuresBatch, in arrival order.</summary>
    public ConcurrentQueue<BookExposuresUpdated> BooksUpdated { get; } = new();
}
