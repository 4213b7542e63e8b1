namespace Monitor.Service.Journal;

/// <summary>
/// The start is stopped: the trade journal has a line failing its check (MAC, parse, sequence, chain), or the books
/// after replay disagree with the exposure log's trade-applied records. The message names each file, line and trade
/// and the documented way to proceed (Journal/README.md, "When the start is refused").
/// </summary>
public sealed class JournalRejectedException : Exception
{
    public JournalRejectedException()
    {
    }

    public JournalRejectedException(string message)
        : base(message)
    {
    }

    public JournalRejectedException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
