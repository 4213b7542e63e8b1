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
}
