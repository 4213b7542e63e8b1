namespace Monitor.Service.Storage;

/// <summary>
/// The writer locks of the exposure log and the trade journal folders (one when both are the same folder), taken
/// before the journal is replayed or either folder written, released when the service's container is disposed.
/// </summary>
public sealed class WriterLocks : IDisposable
{
    private readonly List<FolderWriterLock> _locks = [];

    /// <exception cref="FolderInUseException">A folder is in use; no lock is kept.</exception>
    public WriterLocks(string exposureLogFolder, string journalFolder)
    {
        try
        {
            _locks.Add(FolderWriterLock.Take(exposureLogFolder, "exposure log"));
            if (!string.Equals(Path.GetFullPath(journalFolder), _locks[0].Folder, StringComparison.Ordinal))
            {
                _locks.Add(FolderWriterLock.Take(journalFolder, "trade journal"));
            }
        }
        catch
        {
            Dispose();
            throw;
        }
    }

    public IReadOnlyList<string> Folders => _locks.Select(l => l.Folder).ToArray();

    public void Dispose()
    {
        foreach (var held in _locks)
        {
            held.Dispose();
        }
        _locks.Clear();
    }
}
