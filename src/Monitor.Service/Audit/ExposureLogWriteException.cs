namespace Monitor.Service.Audit;

/// <summary>
/// A record could not be written (unwritable folder, full disk, ...). Nothing was added to the chain:
/// the same append can be retried once the cause is removed.
/// </summary>
public sealed class ExposureLogWriteException : IOException
{
    public ExposureLogWriteException(string path, string reason, Exception? innerException)
        : base($"Exposure log write to '{path}' failed: {reason}", innerException)
    {
        Path = path;
        Reason = reason;
    }

    /// <summary>The day file that was being written.</summary>
    public string Path { get; }

    /// <summary>Why the write failed (the operating system's message).</summary>
    public string Reason { get; }
}
