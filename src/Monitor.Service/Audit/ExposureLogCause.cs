namespace Monitor.Service.Audit;

/// <summary>What caused a record: the message (id and type) or, for scheduled records, the schedule.</summary>
/// <param name="MessageId">Id of the causing message; null when there is none (a timer, a start-up).</param>
/// <param name="MessageType">Type of the causing message, or a name of our own such as "timer" or "writer-start".</param>
public sealed record ExposureLogCause(string? MessageId, string MessageType);
