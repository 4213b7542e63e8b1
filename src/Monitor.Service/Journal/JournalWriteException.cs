namespace Monitor.Service.Journal;

/// <summary>
/// A journal record could not be made durable (unwritable folder, full disk, ...). The record is not in the
/// journal: the message must not be acknowledged, and the same append can be retried once the cause is removed.
/// </summary>
public sealed class JournalWriteException : IOException
{
    public JournalWriteException(string path, string reason, Exception? innerException)
        : base($"Trade journal write to '{path}' failed: {reason}", innerException)
    {
        Path = path;
        Reason = reason;
    }

    /// <summary>The day file that was being written.</summary>
    public string Path { get; }

    /// <summary>Why the write failed (the operating system's message).</summary>
    public string Reason { get; }
}
