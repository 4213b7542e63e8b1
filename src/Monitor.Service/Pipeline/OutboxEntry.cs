namespace Monitor.Service.Pipeline;

/// <summary>
/// An event with a record in the exposure log: the record's <c>seq</c>, the event's stable id (sent as the
/// MassTransit MessageId, the same on every publish of it, so consumers can drop duplicates) and the message.
/// </summary>
public sealed record OutboxEntry(long Seq, Guid Id, object Message)
{
    /// <summary>
    /// The stable id of the event of a log record: the first 16 bytes of SHA-256 over <c>"monitor-event:" + seq + ":" + mac</c> (the record's <c>mac</c>),
    /// as a Guid. Deterministic: the same record always gives the same id (common practice, no source).
    /// </summary>
    public static Guid IdOf(long seq, string recordMac)
    {
        var bytes = System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(
            "monitor-event:" + seq.ToString(System.Globalization.CultureInfo.InvariantCulture) + ":" + recordMac));
        return new Guid(bytes.AsSpan(0, 16));
    }
}
