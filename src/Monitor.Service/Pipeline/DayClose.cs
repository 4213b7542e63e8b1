namespace Monitor.Service.Pipeline;

/// <summary>
/// A business day's close as recorded: the day, the roll moment that closed it, and the <c>day-closed</c> record's
/// seq and hash in the exposure log (what a checkpoint anchors).
/// </summary>
public sealed record DayClose(DateOnly BusinessDate, DateTimeOffset ClosedAt, long LogSeq, string LogMac, int Books);
