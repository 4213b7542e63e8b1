using MassTransit;

namespace Monitor.Service.Hosting;

/// <summary>
/// Bounds the RabbitMQ <c>_error</c> queues the service declares (one per inbound queue, declared at the first refusal):
/// at most <see cref="TransportOptions.ErrorQueueMaxMessages"/> messages (<c>x-max-length</c>, the oldest dropped first:
/// <c>x-overflow</c> drop-head) for at most <see cref="TransportOptions.ErrorQueueMaxAge"/> (<c>x-message-ttl</c>).
/// Without them three refused 60 MB messages held 112 MB of the broker's disk for ever. RabbitMQ refuses to redeclare a
/// queue with other arguments (PRECONDITION_FAILED): an error queue declared by an older build must be deleted (after
/// its messages are read) before this one starts.
/// </summary>
public static class ErrorQueueLimits
{
    public const string MaxLengthArgument = "x-max-length";
    public const string MessageTtlArgument = "x-message-ttl";
    public const string OverflowArgument = "x-overflow";
    public const string DropOldest = "drop-head";

    public const long MostMessages = 10_000_000;
    public static readonly TimeSpan ShortestAge = TimeSpan.FromMinutes(1);
    public static readonly TimeSpan LongestAge = TimeSpan.FromDays(365);

    public static void Configure(IRabbitMqBusFactoryConfigurator cfg, TransportOptions transport)
    {
        ArgumentNullException.ThrowIfNull(cfg);
        ArgumentNullException.ThrowIfNull(transport);
        var arguments = Arguments(transport);
        cfg.SendTopology.ConfigureErrorSettings = queue =>
        {
            foreach (var (key, value) in arguments)
            {
                queue.SetQueueArgument(key, value);
            }
        };
    }

    /// <summary>The queue arguments of every error queue, as declared (whole milliseconds for the age).</summary>
    public static IReadOnlyDictionary<string, object> Arguments(TransportOptions transport)
    {
        ArgumentNullException.ThrowIfNull(transport);
        return new Dictionary<string, object>
        {
            [MaxLengthArgument] = transport.ErrorQueueMaxMessages,
            [MessageTtlArgument] = (long)transport.ErrorQueueMaxAge.TotalMilliseconds,
            [OverflowArgument] = DropOldest,
        };
    }
}
