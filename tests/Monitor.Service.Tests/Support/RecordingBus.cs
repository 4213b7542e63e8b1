using System.Collections.Concurrent;
using System.Reflection;
using MassTransit;

namespace Monitor.Service.Tests.Support;

/// <summary>
/// An <see cref="IBus"/> that records what is published through <c>Publish(object, Type, CancellationToken)</c> and
/// <c>Publish(object, Type, IPipe&lt;PublishContext&gt;, CancellationToken)</c> (the members the outbox uses; the pipe is
/// run on a stand-in context to see the MessageId it sets) and fails publishes while <see cref="Failing"/> is set, as a broker outage would.
/// Any other member throws, so a change that starts using one shows up here.
/// </summary>
public class RecordingBus : DispatchProxy
{
    public ConcurrentQueue<object> Published { get; } = new();

    /// <summary>Every published message with the MessageId its pipe set (null when published without one).</summary>
    public ConcurrentQueue<(object Message, Guid? MessageId)> PublishedWithIds { get; } = new();

    public int Attempts => _attempts;

    public volatile bool Failing;

    private int _attempts;

    public static (IBus Bus, RecordingBus Recorder) Create()
    {
        var bus = Create<IBus, RecordingBus>();
        return (bus, (RecordingBus)(object)bus);
    }

    protected override object? Invoke(MethodInfo? targetMethod, object?[]? args)
    {
        var parameters = targetMethod?.GetParameters().Select(p => p.ParameterType).ToArray();
        if (targetMethod?.Name == nameof(IPublishEndpoint.Publish) && parameters is [var m, var t, var c] && m == typeof(object) && t == typeof(Type) && c == typeof(CancellationToken))
        {
            Interlocked.Increment(ref _attempts);
            if (Failing)
            {
                return Task.FromException(new InvalidOperationException("broker unreachable (test)"));
            }
            Published.Enqueue(args![0]!);
            PublishedWithIds.Enqueue((args[0]!, null));
            return Task.CompletedTask;
        }
        if (targetMethod?.Name == nameof(IPublishEndpoint.Publish) && parameters is [var m2, var t2, var p2, var c2] && m2 == typeof(object) && t2 == typeof(Type)
            && p2 == typeof(IPipe<PublishContext>) && c2 == typeof(CancellationToken))
        {
            Interlocked.Increment(ref _attempts);
            if (Failing)
            {
                return Task.FromException(new InvalidOperationException("broker unreachable (test)"));
            }
            var context = DispatchProxy.Create<PublishContext, StandInPublishContext>();
            ((IPipe<PublishContext>)args![2]!).Send(context).GetAwaiter().GetResult();
            Published.Enqueue(args[0]!);
            PublishedWithIds.Enqueue((args[0]!, ((StandInPublishContext)(object)context).MessageId));
            return Task.CompletedTask;
        }
        throw new NotSupportedException($"RecordingBus does not implement {targetMethod}");
    }
}
