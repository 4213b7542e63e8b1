using System.Text;
using System.Text.Json;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Monitor.Service.Hosting;
using Monitor.Service.Pipeline;
using Monitor.Service.Tests.Support;
using RabbitMQ.Client;
using RabbitMQ.Client.Exceptions;

namespace Monitor.Service.Tests.Broker;

/// <summary>
/// What the service lets grow on the broker: an oversized plain-JSON message is refused unread to the error queue,
/// and the error queues are declared with a length and an age limit (found on the landed main: no limit, 112 MB of
/// error queue from three messages).
/// </summary>
public sealed class BrokerBoundsTests : IDisposable
{
    private static readonly string[] Queues = [InboundEndpoints.Instruments, InboundEndpoints.Quotes, InboundEndpoints.Trades, InboundEndpoints.ParYields];
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [BrokerFact]
    public async Task An_oversized_quote_lands_unread_in_a_bounded_error_queue_with_its_size_and_the_limit()
    {
        var broker = new BrokerEndpoint();
        await broker.InitializeAsync();
        try
        {
            await using var connection = await new ConnectionFactory { Uri = broker.Uri }.CreateConnectionAsync();
            await using (var channel = await connection.CreateChannelAsync())
            {
                await DeleteQueues(channel);
            }
            using var host = await StartService(broker);
            var pipeline = host.Services.GetRequiredService<RiskPipeline>();
            var before = await pipeline.ReadAsync(EngineState.Of);
            var body = JsonSerializer.Serialize(new
            {
                quoteId = "Q-BIG",
                instrumentId = "VGB-2034-11",
                midCleanPrice = 100.0,
                quoteTime = TestMarket.Now.AddMinutes(-1),
                source = "json-producer",
                padding = new int[100_000],
            });
            await using (var channel = await connection.CreateChannelAsync())
            {
                var properties = new BasicProperties { ContentType = "application/json", MessageId = Guid.NewGuid().ToString(), DeliveryMode = DeliveryModes.Persistent };
                await channel.BasicPublishAsync(string.Empty, InboundEndpoints.Quotes, mandatory: true, properties, Encoding.UTF8.GetBytes(body));
            }

            var refused = await GetError(connection, InboundEndpoints.Quotes + "_error");
            var reason = Header(refused, "MT-Fault-Message");
            Assert.Contains($"body: '{Encoding.UTF8.GetByteCount(body)} bytes' is above the limit of 65536 bytes (Transport:MaxMessageBytes)", reason, StringComparison.Ordinal);
            Assert.Equal(Encoding.UTF8.GetByteCount(body), refused.Body.Length);
            Assert.Equal(before, await pipeline.ReadAsync(EngineState.Of));

            // RabbitMQ accepts a redeclaration only with the same arguments (AMQP 0-9-1 queue.declare, "equivalent"):
            // the error queue carries the bounds, and a declaration without them is refused.
            var expected = ErrorQueueLimits.Arguments(new TransportOptions()).ToDictionary(a => a.Key, a => (object?)a.Value);
            Assert.Equal(10_000L, expected[ErrorQueueLimits.MaxLengthArgument]);
            Assert.Equal(7L * 24 * 3600 * 1000, expected[ErrorQueueLimits.MessageTtlArgument]);
            await using (var channel = await connection.CreateChannelAsync())
            {
                await channel.QueueDeclareAsync(InboundEndpoints.Quotes + "_error", durable: true, exclusive: false, autoDelete: false, arguments: expected);
            }
            await using (var channel = await connection.CreateChannelAsync())
            {
                var unbounded = await Assert.ThrowsAsync<OperationInterruptedException>(() =>
                    channel.QueueDeclareAsync(InboundEndpoints.Quotes + "_error", durable: true, exclusive: false, autoDelete: false, arguments: null));
                Assert.Equal((ushort)406, unbounded.ShutdownReason?.ReplyCode); // PRECONDITION_FAILED
            }

            using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
            await host.StopAsync(timeout.Token);
            await using (var channel = await connection.CreateChannelAsync())
            {
                await DeleteQueues(channel);
            }
        }
        finally
        {
            await broker.DisposeAsync();
        }
    }

    private async Task<IHost> StartService(BrokerEndpoint broker)
    {
        File.WriteAllText(_folder.Combine("broker-user"), broker.User);
        File.WriteAllText(_folder.Combine("broker-password"), broker.Password);
        var settings = ServiceUnderTest.Settings(_folder.Combine("exposure-log"));
        settings["Transport:Kind"] = "RabbitMq";
        settings["Transport:Broker:Host"] = broker.Host;
        settings["Transport:Broker:Port"] = broker.Port.ToString(System.Globalization.CultureInfo.InvariantCulture);
        settings["Transport:Broker:VirtualHost"] = broker.VirtualHost;
        settings["Transport:Broker:UserFile"] = _folder.Combine("broker-user");
        settings["Transport:Broker:PasswordFile"] = _folder.Combine("broker-password");
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(settings).Build();
        var builder = Host.CreateEmptyApplicationBuilder(new HostApplicationBuilderSettings());
        builder.Services.AddSingleton<TimeProvider>(new ManualClock(TestMarket.Now));
        builder.Services.AddMonitorService(configuration);
        var host = builder.Build();
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await host.StartAsync(timeout.Token);
        return host;
    }

    private static async Task DeleteQueues(IChannel channel)
    {
        foreach (var queue in Queues)
        {
            await channel.QueueDeleteAsync(queue);
            await channel.QueueDeleteAsync(queue + "_error");
            await channel.QueueDeleteAsync(queue + "_skipped");
        }
    }

    private static async Task<BasicGetResult> GetError(IConnection connection, string queue)
    {
        BasicGetResult? result = null;
        await ServiceUnderTest.WaitUntilAsync(async () => (result = await TryGet(connection, queue)) is not null, "a message in " + queue);
        return result!;
    }

    /// <summary>A fresh channel per try: a get on a queue that does not exist yet closes the channel.</summary>
    private static async Task<BasicGetResult?> TryGet(IConnection connection, string queue)
    {
        try
        {
            await using var channel = await connection.CreateChannelAsync();
            return await channel.BasicGetAsync(queue, autoAck: true);
        }
        catch (OperationInterruptedException)
        {
            return null;
        }
    }

    private static string? Header(BasicGetResult message, string name) =>
        message.BasicProperties.Headers is { } headers && headers.TryGetValue(name, out var value)
            ? value switch { byte[] bytes => Encoding.UTF8.GetString(bytes), null => null, _ => value.ToString() }
            : null;
}
