using System.Net.Mime;
using MassTransit;

namespace Monitor.Service.Hosting;

/// <summary>A MassTransit serializer factory whose deserializer refuses bodies above a size (<see cref="SizeCheckedDeserializer"/>).</summary>
public sealed class SizeCheckedSerializerFactory(ISerializerFactory inner, long maxBytes) : ISerializerFactory
{
    private readonly Lazy<SizeCheckedDeserializer> _deserializer = new(() => new SizeCheckedDeserializer(inner.CreateDeserializer(), maxBytes));

    public ContentType ContentType => inner.ContentType;

    public IMessageSerializer CreateSerializer() => inner.CreateSerializer();

    public IMessageDeserializer CreateDeserializer() => _deserializer.Value;
}
