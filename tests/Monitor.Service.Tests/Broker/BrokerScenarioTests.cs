using System.Text;
using System.Text.Json;
using MassTransit;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Monitor.Analytics.Market;
using Monitor.Limits;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Pipeline;
using Monitor.Service.Tests.Support;
using Monitor.Service.Consumers;
using Monitor.Service.Messaging;
using RabbitMQ.Client;
using Serilog;
using Serilog.Events;

namespace Monitor.Service.Tests.Broker;

/// <summary>
/// The service end-to-end over a real RabbitMQ broker (BrokerLocator: MONITOR_TEST_BROKER, else Testcontainers,
/// else skipped unless MONITOR_REQUIRE_BROKER=1). Producers publish plain camelCase JSON with RabbitMQ.Client straight
/// to the inbound queues, as a producer in another language would. Every wait is bounded (30 s).
/// </summary>
public sealed class BrokerScenarioTests : IDisposable
{
    private static readonly string[] Queues = [InboundEndpoints.Instruments, InboundEndpoints.Quotes, InboundEndpoints.Trades, InboundEndpoints.ParYields];
    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [BrokerFact]
    public async Task Plain_json_quotes_and_trades_drive_warning_breach_and_clear_over_rabbitmq()
    {
        // The same scenario as the in-memory pipeline test: limit placed from the same steps on a plain engine.
        var rally1 = TestMarket.Between(-1, TestMarket.Now.AddMinutes(-20));
        var rally2 = TestMarket.Between(-2, TestMarket.Now.AddMinutes(-10));
        var probe = TestMarket.OpenedEngine();
        probe.ApplyTrade(new TradeInput("H-1", 1, TradeAction.New, "RATES-CURVE", "VGB-2027-11", -100_000_000, 100, TestMarket.Now), TestMarket.Now);
        var e1 = Dv01AfterQuotes(probe, rally1);
        var e2 = Dv01AfterQuotes(probe, rally2);
        var limit = Math.Min(e2, e1 / 0.8) * 0.99;
        var limits = TestMarket.WriteLimits(_folder.Path,
            $"{{ \"id\": \"t-curve-dv01\", \"scope\": \"book\", \"scopeId\": \"RATES-CURVE\", \"measure\": \"dv01\", \"upper\": {TestMarket.Inv(limit)} }}");

        var broker = new BrokerEndpoint();
        await broker.InitializeAsync();
        try
        {
            await using var connection = await Connect(broker);
            await using var channel = await connection.CreateChannelAsync();
            await DeleteQueues(channel);
            var (host, events) = await StartService(broker, limits);
            using (host)
            {
                await WaitUntil(() => StatusesOf(events).Length >= 1, "opening breach");
                await PublishJson(channel, InboundEndpoints.Trades, Trade("H-1", "RATES-CURVE", "VGB-2027-11", -100_000_000));
                await WaitUntil(() => StatusesOf(events).Length >= 2, "hedge clears");
                foreach (var q in rally1)
                {
                    await PublishJson(channel, InboundEndpoints.Quotes, Quote(q));
                }
                await WaitUntil(() => StatusesOf(events).Length >= 3, "warning after the first rally");
                foreach (var q in rally2)
                {
                    await PublishJson(channel, InboundEndpoints.Quotes, Quote(q));
                }
                await WaitUntil(() => StatusesOf(events).Length >= 4, "breach after the second rally");
                await PublishJson(channel, InboundEndpoints.Trades, Trade("R-1", "RATES-CURVE", "VGB-2051-11", -8_000_000));
                await WaitUntil(() => StatusesOf(events).Length >= 5, "sale clears");

                Assert.Equal(["breach", "within", "warning", "breach", "within"], StatusesOf(events));
                Assert.Contains(events.BooksUpdated, b => b.Book == "RATES-CURVE" && b.CauseMessageType == "BondQuoted");
                var pipeline = host.Services.GetRequiredService<RiskPipeline>();
                // 12m at the start of day, 8m sold by the plain-JSON trade R-1.
                Assert.Equal(4_000_000, await pipeline.ReadAsync(e => e.Books["RATES-CURVE"].Positions["VGB-2051-11"]));
                await StopService(host);
            }
            var log = ExposureLogVerifier.VerifyFolder(TestKey.Value, _folder.Combine("exposure-log"));
            Assert.True(log.Intact, string.Join("; ", log.Problems));
            await DeleteQueues(channel);
        }
        finally
        {
            await broker.DisposeAsync();
        }
    }

    [BrokerFact]
    public async Task Malformed_and_refused_messages_land_in_the_error_queue_with_the_reason_and_one_warning_line()
    {
        var broker = new BrokerEndpoint();
        await broker.InitializeAsync();
        try
        {
            await using var connection = await Connect(broker);
            await using var channel = await connection.CreateChannelAsync();
            await DeleteQueues(channel);
            var everything = new CapturedLogEvents();
            var kept = new CapturedLogEvents();
            var (host, _) = await StartService(broker, TestMarket.Data("limits.json"), logger => logger
                .WriteTo.Sink(everything)
                .WriteTo.Logger(l => l.Filter.With(new RefusalLogEvents()).WriteTo.Sink(kept)));
            using (host)
            {
                var pipeline = host.Services.GetRequiredService<RiskPipeline>();
                var before = await pipeline.ReadAsync(EngineState.Of);
                await PublishRaw(channel, InboundEndpoints.Trades, "{\"tradeId\": \"M-1\", \"version\": 1, \"action\": ");
                var malformed = await GetError(connection, InboundEndpoints.Trades + "_error");
                Assert.Contains("M-1", Encoding.UTF8.GetString(malformed.Body.Span), StringComparison.Ordinal);
                Assert.StartsWith("action: is not valid JSON", Header(malformed, "MT-Fault-Message"), StringComparison.Ordinal);

                await PublishJson(channel, InboundEndpoints.Trades, Trade("U-1", "NO-SUCH-BOOK", "VGB-2034-11", 1_000_000));
                var refused = await GetError(connection, InboundEndpoints.Trades + "_error");
                Assert.Contains("book: 'NO-SUCH-BOOK'", Header(refused, "MT-Fault-Message"), StringComparison.Ordinal);

                // Issue 11: a type error names the wire field in words, not the JSON reader's sentence; so does a NaN literal.
                var mistyped = JsonSerializer.Serialize(Trade("T-1", "RATES-CURVE", "VGB-2034-11", 1_000_000), Json).Replace("1000000", "\"abc\"", StringComparison.Ordinal);
                await PublishRaw(channel, InboundEndpoints.Trades, mistyped);
                Assert.Equal("faceAmount: '\"abc\"' must be a number, e.g. 99.5.", Header(await GetError(connection, InboundEndpoints.Trades + "_error"), "MT-Fault-Message"));
                await PublishRaw(channel, InboundEndpoints.Trades, mistyped.Replace("\"abc\"", "NaN", StringComparison.Ordinal));
                Assert.StartsWith("faceAmount: is not valid JSON", Header(await GetError(connection, InboundEndpoints.Trades + "_error"), "MT-Fault-Message"), StringComparison.Ordinal);
                Assert.Equal(before, await pipeline.ReadAsync(EngineState.Of));
                await StopService(host);
            }
            await DeleteQueues(channel);

            // One Warning line per refused message, naming the field; nothing at Error once MassTransit's own fault lines are dropped.
            var refusals = kept.Events.Where(e => e.Properties.TryGetValue("SourceContext", out var c) && c.ToString() == $"\"{RefusalLogEvents.Category}\"").ToArray();
            Assert.Equal(["action", "book", "faceAmount", "faceAmount"], refusals.Select(e => ((ScalarValue)e.Properties["Field"]).Value as string));
            Assert.All(refusals, e => Assert.Equal(LogEventLevel.Warning, e.Level));
            Assert.All(refusals, e => Assert.Null(e.Exception));
            Assert.All(refusals, e => Assert.True(e.Properties.ContainsKey("MessageId")));
            var errors = kept.Events.Where(e => e.Level >= LogEventLevel.Error).Select(e => $"{e.Properties.GetValueOrDefault("SourceContext")} {e.RenderMessage()} {e.Exception?.GetType().Name}: {e.Exception?.Message}").ToArray();
            Assert.True(errors.Length == 0, string.Join("\n", errors));
            Assert.DoesNotContain(kept.Events, e => e.Exception is MessageRejectedException);
            // The filter has work to do: MassTransit itself logs each refusal with its exception.
            Assert.Contains(everything.Events, RefusalLogEvents.IsMassTransitRefusal);
        }
        finally
        {
            await broker.DisposeAsync();
        }
    }

    private async Task<(IHost Host, RecordedEvents Events)> StartService(BrokerEndpoint broker, string limitsFile, Action<LoggerConfiguration>? logging = null)
    {
        File.WriteAllText(_folder.Combine("broker-user"), broker.User);
        File.WriteAllText(_folder.Combine("broker-password"), broker.Password);
        var settings = ServiceUnderTest.Settings(_folder.Combine("exposure-log"), limitsFile);
        settings["Monitor:ConflationWindow"] = "00:00:00.500";
        settings["Transport:Kind"] = "RabbitMq";
        settings["Transport:Broker:Host"] = broker.Host;
        settings["Transport:Broker:Port"] = broker.Port.ToString(System.Globalization.CultureInfo.InvariantCulture);
        settings["Transport:Broker:VirtualHost"] = broker.VirtualHost;
        settings["Transport:Broker:UserFile"] = _folder.Combine("broker-user");
        settings["Transport:Broker:PasswordFile"] = _folder.Combine("broker-password");
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(settings).Build();
        var builder = Host.CreateEmptyApplicationBuilder(new HostApplicationBuilderSettings());
        var events = new RecordedEvents();
        builder.Services.AddSingleton(events);
        if (logging is not null)
        {
            // As config/service.json: the health check service's own lines are silenced (the publisher logs each change).
            var logger = new LoggerConfiguration().MinimumLevel.Information()
                .MinimumLevel.Override("Microsoft.Extensions.Diagnostics.HealthChecks", LogEventLevel.Fatal);
            logging(logger);
            builder.Services.AddSerilog(logger.CreateLogger(), dispose: true);
        }
        builder.Services.AddSingleton<TimeProvider>(new ManualClock(TestMarket.Now));
        var recorderQueue = "monitor-test-events-" + Guid.NewGuid().ToString("N")[..8];
        builder.Services.AddMonitorService(configuration, bus => bus.AddConsumer<EventRecorder>().Endpoint(e =>
        {
            e.Name = recorderQueue;
            e.Temporary = true;
        }));
        var host = builder.Build();
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await host.StartAsync(timeout.Token);
        return (host, events);
    }

    private static async Task StopService(IHost host)
    {
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await host.StopAsync(timeout.Token);
    }

    private static double Dv01AfterQuotes(RiskEngine engine, IReadOnlyList<BondQuote> quotes)
    {
        foreach (var q in quotes)
        {
            engine.AcceptQuote(q, TestMarket.Now);
        }
        engine.RefitDirtyCurves(TestMarket.Now);
        return engine.Books["RATES-CURVE"].Exposures!.Totals[ExposureMeasure.Dv01];
    }

    private static string[] StatusesOf(RecordedEvents events) =>
        events.StatusChanges.Where(c => c.LimitId == "t-curve-dv01").Select(c => c.Status).ToArray();

    private static object Trade(string id, string book, string instrument, double face) => new
    {
        tradeId = id,
        version = 1,
        action = "new",
        book,
        instrumentId = instrument,
        faceAmount = face,
        cleanPrice = 100.0,
        tradeTime = TestMarket.Now.AddMinutes(-1),
    };

    private static object Quote(BondQuote q) => new
    {
        quoteId = Guid.NewGuid().ToString("N"),
        instrumentId = q.InstrumentId,
        midCleanPrice = q.Mid,
        quoteTime = q.QuoteTime,
        source = "json-producer",
    };

    private static async Task<IConnection> Connect(BrokerEndpoint broker)
    {
        var factory = new ConnectionFactory { Uri = broker.Uri };
        return await factory.CreateConnectionAsync();
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

    private static Task PublishJson(IChannel channel, string queue, object body) =>
        PublishRaw(channel, queue, JsonSerializer.Serialize(body, Json));

    private static async Task PublishRaw(IChannel channel, string queue, string body)
    {
        var properties = new BasicProperties
        {
            ContentType = "application/json",
            MessageId = Guid.NewGuid().ToString(),
            DeliveryMode = DeliveryModes.Persistent,
        };
        await channel.BasicPublishAsync(string.Empty, queue, mandatory: true, properties, Encoding.UTF8.GetBytes(body));
    }

    private static async Task<BasicGetResult> GetError(IConnection connection, string queue)
    {
        BasicGetResult? result = null;
        await WaitUntil(async () => (result = await TryGet(connection, queue)) is not null, "a message in " + queue);
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
        catch (RabbitMQ.Client.Exceptions.OperationInterruptedException)
        {
            return null; // the error queue does not exist until the first fault
        }
    }

    private static string? Header(BasicGetResult message, string name) =>
        message.BasicProperties.Headers is { } headers && headers.TryGetValue(name, out var value)
            ? value switch { byte[] bytes => Encoding.UTF8.GetString(bytes), null => null, _ => value.ToString() }
            : null;

    private static Task WaitUntil(Func<bool> condition, string what) => ServiceUnderTest.WaitUntilAsync(condition, what);

    private static Task WaitUntil(Func<Task<bool>> condition, string what) => ServiceUnderTest.WaitUntilAsync(condition, what);
}
