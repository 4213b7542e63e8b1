using System.Globalization;
using System.Net.Mime;
using MassTransit;
using Monitor.Service.Messaging;

namespace Monitor.Service.Hosting;

/// <summary>
/// Refuses a message body above <c>Transport:MaxMessageBytes</c> before the wrapped deserializer reads it. MassTransit's
/// JSON deserializers parse the whole body into a <c>JsonDocument</c> first (the envelope and the raw path alike), so a
/// 60 MB quote, or a small quote with a 2-million-element member no contract has, costs its size several times over
/// (the parser's buffers come from the shared array pool, which keeps them). The refusal is a
/// <see cref="MessageRejectedException"/> thrown inside MassTransit's deserialize filter: the message goes to the
/// queue's <c>_error</c> queue with the reason in <c>MT-Fault-Message</c>, is never retried and changes nothing.
/// </summary>
public sealed class SizeCheckedDeserializer(IMessageDeserializer inner, long maxBytes) : IMessageDeserializer
{
    public ContentType ContentType => inner.ContentType;

    public long MaxBytes => maxBytes;

    public void Probe(ProbeContext context) => inner.Probe(context);

    public ConsumeContext Deserialize(ReceiveContext receiveContext)
    {
        ArgumentNullException.ThrowIfNull(receiveContext);
        Check(receiveContext.Body);
        return inner.Deserialize(receiveContext);
    }

    public SerializerContext Deserialize(MessageBody body, Headers headers, Uri? destinationAddress = null)
    {
        ArgumentNullException.ThrowIfNull(body);
        Check(body);
        return inner.Deserialize(body, headers, destinationAddress);
    }

    public MessageBody GetMessageBody(string text) => inner.GetMessageBody(text);

    private void Check(MessageBody body)
    {
        // The transports (RabbitMQ, in-memory) hold the body as bytes and know its length; GetBytes only for others.
        var length = body.Length ?? body.GetBytes().LongLength;
        if (length > maxBytes)
        {
            throw new MessageRejectedException("body", string.Create(CultureInfo.InvariantCulture, $"{length} bytes"),
                string.Create(CultureInfo.InvariantCulture, $"is above the limit of {maxBytes} bytes (Transport:{nameof(TransportOptions.MaxMessageBytes)}); refused unread."));
        }
    }
}
