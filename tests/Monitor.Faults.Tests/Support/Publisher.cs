using System.Text;
using RabbitMQ.Client;
using RabbitMQ.Client.Exceptions;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// Publishes plain JSON to the service's inbound queues (default exchange, routing key = queue name) with publisher
/// confirms, so a message counts as sent only once the broker has taken it; persistent, so it survives a broker stop.
/// </summary>
public sealed class Publisher : IAsyncDisposable
{
    private readonly IConnection _connection;
    private readonly IChannel _channel;

    private Publisher(IConnection connection, IChannel channel)
    {
        _connection = connection;
        _channel = channel;
    }

    public static async Task<Publisher> ConnectAsync(string vhost)
    {
        var connection = await Factory(vhost).CreateConnectionAsync("monitor-fault-tests");
        var channel = await connection.CreateChannelAsync(new CreateChannelOptions(publisherConfirmationsEnabled: true, publisherConfirmationTrackingEnabled: true));
        return new Publisher(connection, channel);
    }

    public static ConnectionFactory Factory(string vhost) => new()
    {
        HostName = "localhost",
        Port = 5672,
        VirtualHost = vhost,
        UserName = BrokerAdmin.User,
        Password = BrokerAdmin.Password,
        AutomaticRecoveryEnabled = false,
    };

    /// <summary>Publishes and waits for the broker's confirm; throws if the broker refuses it.</summary>
    public async Task PublishAsync(StreamMessage message, CancellationToken cancellationToken)
    {
        var properties = new BasicProperties
        {
            ContentType = "application/json",
            DeliveryMode = DeliveryModes.Persistent,
            MessageId = Guid.NewGuid().ToString(),
        };
        await _channel.BasicPublishAsync(string.Empty, message.Queue, mandatory: false, properties, Encoding.UTF8.GetBytes(message.Json), cancellationToken);
    }

    /// <summary>Ready messages in a queue, or null when the queue does not exist (yet).</summary>
    public async Task<uint?> ReadyCountAsync(string queue)
    {
        // A passive declare of a missing queue closes its channel: use a throw-away one.
        await using var channel = await _connection.CreateChannelAsync();
        try
        {
            var ok = await channel.QueueDeclarePassiveAsync(queue);
            return ok.MessageCount;
        }
        catch (OperationInterruptedException)
        {
            return null;
        }
    }

    public async ValueTask DisposeAsync()
    {
        await _channel.DisposeAsync();
        await _connection.DisposeAsync();
    }
}
