namespace Monitor.Service.Audit;

/// <summary>
/// The writer cannot find where the chain stopped (unreadable folder or file, or a last complete
/// line that is unparsable or fails its own hash), so it refuses to start rather than fork the chain.
/// </summary>
public sealed class ExposureLogOpenException : IOException
{
    public ExposureLogOpenException(string path, string reason, Exception? innerException = null)
        : base($"Exposure log '{path}' cannot be continued: {reason}", innerException)
    {
        Path = path;
        Reason = reason;
    }

    /// <summary>The folder or day file at fault.</summary>
    public string Path { get; }

    /// <summary>What is wrong with it.</summary>
    public string Reason { get; }
}
