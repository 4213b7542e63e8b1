using System.Net.Mime;
using MassTransit;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using Monitor.Contracts.V1;
using MassTransit.Configuration;
using Monitor.Service.Consumers;
using Monitor.Service.Messaging;

namespace Monitor.Service.Hosting;

/// <summary>
/// The inbound queues, one message type each so that plain JSON (no MassTransit envelope) from producers in
/// other languages maps to its type unambiguously. Refused messages are not retried: MassTransit moves them
/// to the queue's error queue (<c>&lt;queue&gt;_error</c>) with the reason in the fault headers.
/// </summary>
public static class InboundEndpoints
{
    public const string Instruments = "monitor-instruments";
    public const string Quotes = "monitor-quotes";
    public const string Trades = "monitor-trades";
    public const string ParYields = "monitor-par-yields";

    public static void AddConsumers(IBusRegistrationConfigurator bus)
    {
        ArgumentNullException.ThrowIfNull(bus);
        bus.AddConsumer<InstrumentDefinedConsumer>();
        bus.AddConsumer<BondQuotedConsumer>();
        bus.AddConsumer<TradeBookedConsumer>();
        bus.AddConsumer<ParYieldsPublishedConsumer>();
    }

    public static void Configure(IBusRegistrationContext context, IBusFactoryConfigurator cfg, TransportOptions transport)
    {
        ArgumentNullException.ThrowIfNull(cfg);
        // Lets .NET producers on this bus send plain JSON too (content type application/json); the default stays the envelope.
        cfg.AddRawJsonSerializer(RawSerializerOptions.AnyMessageType);
        Endpoint<InstrumentDefinedConsumer, InstrumentDefined>(context, cfg, Instruments, transport);
        Endpoint<BondQuotedConsumer, BondQuoted>(context, cfg, Quotes, transport);
        Endpoint<TradeBookedConsumer, TradeBooked>(context, cfg, Trades, transport);
        Endpoint<ParYieldsPublishedConsumer, ParYieldsPublished>(context, cfg, ParYields, transport);
    }

    private static void Endpoint<TConsumer, TMessage>(IBusRegistrationContext context, IBusFactoryConfigurator cfg, string queue, TransportOptions transport)
        where TConsumer : class, IConsumer<TMessage>
        where TMessage : class
    {
        var refusals = context.GetRequiredService<ILoggerFactory>().CreateLogger(RefusalLogEvents.Category);
        cfg.ReceiveEndpoint(queue, e =>
        {
            // Plain JSON is accepted beside MassTransit's envelope; a message without a content type is read as plain JSON.
            // Both deserializers refuse a body above Transport:MaxMessageBytes before they parse it (SizeCheckedDeserializer); the
            // plain-JSON one reads the message at once, so a body that is not JSON or a field of the wrong type is a refusal naming it.
            e.AddDeserializer(new SizeCheckedSerializerFactory(new SystemTextJsonMessageSerializerFactory(), transport.MaxMessageBytes));
            e.AddDeserializer(new SizeCheckedSerializerFactory(new RefusingJsonDeserializer<TMessage>(refusals), transport.MaxMessageBytes));
            e.DefaultContentType = new ContentType("application/json");
            e.ConcurrentMessageLimit = transport.ConcurrentMessageLimit;
            // Storage failures never reach this policy: the pipeline holds a failing write (Storage/StorageFaultGate) until it
            // succeeds, so the consumer does not return and its message stays unacknowledged. At shutdown the gate gives up
            // with the consume context's own token, which this filter and MassTransit pass on as a cancelled delivery (the
            // message returns to its queue), not as a fault for the error queue.
            e.UseMessageRetry(r =>
            {
                r.Ignore<MessageRejectedException>();
                r.Ignore<System.Text.Json.JsonException>();
                r.Intervals(100, 500, 2000);
            });
            // Inside the retry: an unreadable body becomes a refusal naming the field, and each refusal is logged once.
            e.UseFilter(new RefusalFilter(typeof(TMessage), refusals));
            e.ConfigureConsumer<TConsumer>(context);
        });
    }
}
