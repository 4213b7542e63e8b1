namespace Monitor.Service.Messaging;

/// <summary>
/// A message the service refuses: bad field, unknown instrument or book, conflicting trade version...
/// It is never retried; MassTransit moves it to the endpoint's error queue with this reason in its
/// fault headers, and no state has changed.
/// </summary>
public sealed class MessageRejectedException : Exception
{
    public MessageRejectedException(string field, string? value, string reason)
        : base(value is null ? $"{field}: {reason}" : $"{field}: '{value}' {reason}")
    {
        Field = field;
        Value = value;
        Reason = reason;
    }

    /// <summary>The message field at fault, in the contract's camelCase JSON spelling.</summary>
    public string Field { get; }

    public string? Value { get; }

    public string Reason { get; }
}
