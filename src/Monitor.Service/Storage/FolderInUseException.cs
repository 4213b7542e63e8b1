namespace Monitor.Service.Storage;

/// <summary>
/// The writer lock of a log or journal folder could not be taken: another <c>monitor run</c> holds it (or the lock file
/// cannot be opened). The message names the folder, the holder as it wrote itself down, and what to do.
/// </summary>
public sealed class FolderInUseException(string folder, string message, Exception? inner = null) : IOException(message, inner)
{
    /// <summary>The folder whose lock was refused.</summary>
    public string Folder { get; } = folder;
}
