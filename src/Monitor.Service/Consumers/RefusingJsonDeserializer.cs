using System.Net.Mime;
using MassTransit;
using MassTransit.Configuration;
using Microsoft.Extensions.Logging;
using Monitor.Service.Messaging;

namespace Monitor.Service.Consumers;

/// <summary>
/// MassTransit's plain-JSON deserializer, with one change: the message is read here, at once, so that a body that is not
/// JSON (cut off, not an object) or a field of the wrong type (<c>"faceAmount": "abc"</c>, a literal NaN) fails before
/// any consume filter runs, as a <see cref="MessageRejectedException"/> naming the wire field (or
/// <see cref="JsonRefusal.BodyField"/>), logged as one Warning line like every refusal (<see cref="RefusalFilter"/>).
/// MassTransit would otherwise read the message lazily, ahead of the endpoint's filters, and fault with the reader's sentence.
/// </summary>
public sealed class RefusingJsonDeserializer<TMessage>(ILogger logger) : ISerializerFactory, IMessageDeserializer
    where TMessage : class
{
    private static readonly Type Contract = typeof(TMessage);

    private readonly ISerializerFactory _raw = new SystemTextJsonRawMessageSerializerFactory(RawSerializerOptions.AnyMessageType);
    private IMessageDeserializer? _inner;

    public ContentType ContentType => _raw.ContentType;

    private IMessageDeserializer Inner => _inner ??= _raw.CreateDeserializer();

    public IMessageSerializer CreateSerializer() => _raw.CreateSerializer();

    public IMessageDeserializer CreateDeserializer() => this;

    public void Probe(ProbeContext context) => Inner.Probe(context);

    public ConsumeContext Deserialize(ReceiveContext receiveContext)
    {
        ArgumentNullException.ThrowIfNull(receiveContext);
        try
        {
            var context = Inner.Deserialize(receiveContext);
            _ = context.TryGetMessage<TMessage>(out _);
            return context;
        }
        catch (Exception ex) when (RefusalFilter.FindJson(ex) is { } json)
        {
            var refusal = JsonRefusal.From(json, Contract, RefusalFilter.Body(receiveContext));
            RefusalFilter.Log(logger, Contract, receiveContext.TransportHeaders.Get<string>("message-id"), refusal);
            throw refusal;
        }
    }

    public SerializerContext Deserialize(MessageBody body, Headers headers, Uri? destinationAddress = null) => Inner.Deserialize(body, headers, destinationAddress);

    public MessageBody GetMessageBody(string text) => Inner.GetMessageBody(text);
}
