using System.Text.Json;
using MassTransit;
using MassTransit.Serialization;
using Microsoft.Extensions.Logging;
using Monitor.Service.Messaging;

namespace Monitor.Service.Consumers;

/// <summary>
/// On each inbound endpoint, inside the retry filter: a body that System.Text.Json cannot read as the endpoint's contract
/// becomes a <see cref="MessageRejectedException"/> naming the wire field (<see cref="JsonRefusal"/>), and every refusal is
/// logged here as one Warning line (message id, field, value, reason) before MassTransit moves the message to the error
/// queue with the same reason in its fault headers. MassTransit's own fault log of a refusal is dropped
/// (<see cref="RefusalLogEvents"/>): a refused message is the producer's error, not a fault of the service.
/// </summary>
public sealed partial class RefusalFilter(Type contract, ILogger logger) : IFilter<ConsumeContext>
{
    public async Task Send(ConsumeContext context, IPipe<ConsumeContext> next)
    {
        ArgumentNullException.ThrowIfNull(context);
        ArgumentNullException.ThrowIfNull(next);
        try
        {
            await next.Send(context).ConfigureAwait(false);
        }
        catch (MessageRejectedException refusal)
        {
            Log(context, refusal);
            throw;
        }
        catch (Exception ex) when ((FindJson(ex) ?? ReadAgain(context)) is { } json)
        {
            var refusal = JsonRefusal.From(json, contract, Body(context));
            Log(context, refusal);
            throw refusal;
        }
    }

    public void Probe(ProbeContext context) => context.CreateFilterScope("monitorRefusals");

    private void Log(ConsumeContext context, MessageRejectedException refusal) =>
        Log(logger, contract, context.MessageId?.ToString(), refusal);

    internal static void Log(ILogger logger, Type contract, string? messageId, MessageRejectedException refusal) =>
        Refused(logger, contract.Name, messageId ?? "(none)", refusal.Field, refusal.Value ?? "", refusal.Reason);

    /// <summary>
    /// MassTransit reads a plain-JSON message from a parsed element, where a wrong token type surfaces as a bare
    /// InvalidOperationException without a path ("Cannot get the value of a token type 'String' as a number"). Reading
    /// the body again with the same options gives the JsonException with its path; null when the body reads cleanly
    /// (the failure was not the body's).
    /// </summary>
    private JsonException? ReadAgain(ConsumeContext context)
    {
        if (Body(context) is not { } body)
        {
            return null;
        }
        try
        {
            using var document = JsonDocument.Parse(body);
            var root = document.RootElement;
            // MassTransit's envelope carries the message under "message".
            var message = root.ValueKind == JsonValueKind.Object && root.TryGetProperty("message", out var inner) && inner.ValueKind == JsonValueKind.Object
                && root.TryGetProperty("messageType", out _) ? inner : root;
            _ = message.Deserialize(contract, SystemTextJsonMessageSerializer.Options);
            return null;
        }
        catch (JsonException json)
        {
            return json;
        }
        catch (Exception ex) when (ex is InvalidOperationException or NotSupportedException or ArgumentException)
        {
            return null;
        }
    }

    internal static JsonException? FindJson(Exception? ex)
    {
        for (; ex is not null; ex = ex.InnerException)
        {
            if (ex is JsonException json)
            {
                return json;
            }
        }
        return null;
    }

    private static string? Body(ConsumeContext context) => Body(context.ReceiveContext);

    internal static string? Body(ReceiveContext context)
    {
        try
        {
            return context.Body.GetString();
        }
        catch (Exception ex) when (ex is InvalidOperationException or NotSupportedException or ArgumentException)
        {
            return null;
        }
    }

    [LoggerMessage(EventId = 4001, Level = LogLevel.Warning,
        Message = "Refused {MessageType} {MessageId}: {Field} {Value} {Reason} (moved to the error queue)")]
    private static partial void Refused(ILogger logger, string messageType, string messageId, string field, string value, string reason);
}
