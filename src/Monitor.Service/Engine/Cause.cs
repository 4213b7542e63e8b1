namespace Monitor.Service.Engine;

/// <summary>The message that caused a change: its type, its id and the event time it carried.</summary>
public sealed record Cause(string MessageType, string MessageId, DateTimeOffset EventTime)
{
    /// <summary>A change made by the service itself (start of day, periodic snapshot, reload).</summary>
    public static Cause Internal(string what, DateTimeOffset time) => new(what, string.Empty, time);
}
