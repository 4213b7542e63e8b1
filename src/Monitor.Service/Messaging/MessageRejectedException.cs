namespace Monitor.Service.Messaging;

/// <summary>
/// A message the service refuses: bad field, unknown instrument or book, conflicting trade version...
/// It is never retried; MassTransit moves it to the endpoint's error queue with this reason in its
/// fault headers, and no state has changed.
/// </summary>
public sealed class MessageRejectedException : Exception
{
    public MessageRejectedException(string field, string? value, string reason)
        : base(value is null ? $"{field}: {reason}" : $"{field}: '{Clip(value)}' {reason}")
    {
        Field = field;
        Value = value;
        Reason = reason;
    }

    /// <summary>The message field at fault, in the contract's camelCase JSON spelling.</summary>
    public string Field { get; }

    public string? Value { get; }

    public string Reason { get; }

    /// <summary>A value quoted in the message is cut at 40 characters: an oversized field must not make an oversized log line.</summary>
    private static string Clip(string value) => value.Length > 43 ? value[..40] + "..." : value;
}
