namespace Monitor.Service.Hosting;

/// <summary>
/// Configuration section <c>Transport</c>. Credentials never live in the repository: the user name and
/// password come from the environment (<c>MONITOR_BROKER_USER</c>, <c>MONITOR_BROKER_PASSWORD</c>) or
/// from secret files named here.
/// </summary>
public sealed class TransportOptions
{
    public const string SectionName = "Transport";

    /// <summary>InMemory (default) or RabbitMq.</summary>
    public TransportKind Kind { get; set; } = TransportKind.InMemory;

    public BrokerOptions Broker { get; set; } = new();

    /// <summary>How many messages one endpoint processes at once. Default 1 keeps quotes and trades in order.</summary>
    public int ConcurrentMessageLimit { get; set; } = 1;

    /// <summary>
    /// Largest inbound message body in bytes; a larger one is refused unread to the queue's error queue. Default 64 KiB
    /// (a quote is about 250 bytes, a par-yield set of 30 points about 3 KiB).
    /// </summary>
    public long MaxMessageBytes { get; set; } = DefaultMaxMessageBytes;

    public const long DefaultMaxMessageBytes = 64 * 1024;

    /// <summary>Bounds of <see cref="MaxMessageBytes"/>: 1 KiB up to RabbitMQ.Client's own default body limit of 64 MiB.</summary>
    public const long MinMaxMessageBytes = 1024;

    public const long MaxMaxMessageBytes = 64L * 1024 * 1024;

    /// <summary>
    /// RabbitMQ only: most messages an <c>_error</c> queue holds (<c>x-max-length</c>); beyond it the oldest is dropped
    /// (<c>x-overflow</c> drop-head). Default 10,000.
    /// </summary>
    public long ErrorQueueMaxMessages { get; set; } = 10_000;

    /// <summary>RabbitMQ only: how long a message stays in an <c>_error</c> queue (<c>x-message-ttl</c>). Default 7 days.</summary>
    public TimeSpan ErrorQueueMaxAge { get; set; } = TimeSpan.FromDays(7);
}
