using System.Collections.Concurrent;
using MassTransit;

namespace Monitor.Service.Tests.Support;

/// <summary>Records the exceptions that made MassTransit fault a received message (before or during its consumer).</summary>
public sealed class ReceiveFaults : IReceiveObserver
{
    private readonly ConcurrentQueue<(Uri? Queue, Exception Exception)> _faults = new();

    public IReadOnlyList<(Uri? Queue, Exception Exception)> All => _faults.ToArray();

    public Task PreReceive(ReceiveContext context) => Task.CompletedTask;

    public Task PostReceive(ReceiveContext context) => Task.CompletedTask;

    public Task PostConsume<T>(ConsumeContext<T> context, TimeSpan duration, string consumerType)
        where T : class => Task.CompletedTask;

    public Task ConsumeFault<T>(ConsumeContext<T> context, TimeSpan duration, string consumerType, Exception exception)
        where T : class => Task.CompletedTask;

    public Task ReceiveFault(ReceiveContext context, Exception exception)
    {
        _faults.Enqueue((context.InputAddress, exception));
        return Task.CompletedTask;
    }
}
