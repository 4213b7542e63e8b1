namespace Monitor.Service.Hosting;

/// <summary>Which message transport the service runs on.</summary>
public enum TransportKind
{
    /// <summary>MassTransit's in-memory transport: the embedded default, needs nothing installed.</summary>
    InMemory,

    /// <summary>A RabbitMQ broker (production).</summary>
    RabbitMq,
}
