using System.Diagnostics;
using System.Globalization;
using System.Text;

namespace Monitor.Service.Storage;

/// <summary>
/// One writer per folder: an exclusive OS lock on <c>writer.lock</c> in the folder (opened with
/// <see cref="FileShare.None"/>, which .NET takes as <c>flock(LOCK_EX)</c> on Linux and a share-none open on Windows),
/// held until disposed, i.e. for the life of the service. Only the lock counts, not the file: the OS drops it when the
/// process ends, however it ends, so the file a killed process leaves behind never blocks a restart.
/// The holder (pid, process start, host) is written into the lock file and, because another process's .NET open of a
/// share-none file is refused even for reading, also into <c>writer.json</c> beside it for the refused instance to name.
/// </summary>
public sealed class FolderWriterLock : IDisposable
{
    public const string LockFileName = "writer.lock";
    public const string HolderFileName = "writer.json";

    // What .NET reports when the lock is held by another open: ERROR_SHARING_VIOLATION on Windows, errno EWOULDBLOCK (11,
    // from flock with LOCK_NB) on Linux.
    private const int SharingViolation = unchecked((int)0x80070020);
    private const int WouldBlock = 11;

    private readonly FileStream _lock;

    private FolderWriterLock(string folder, FileStream stream)
    {
        Folder = folder;
        _lock = stream;
    }

    /// <summary>The locked folder (full path).</summary>
    public string Folder { get; }

    /// <summary>Creates the folder when missing and takes its lock.</summary>
    /// <param name="folder">The folder to lock (the exposure log's or the journal's).</param>
    /// <param name="role">What the folder holds, for the message ("exposure log", "trade journal").</param>
    /// <exception cref="FolderInUseException">Another process (or another service in this one) holds the lock, or the lock file cannot be opened.</exception>
    public static FolderWriterLock Take(string folder, string role)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(folder);
        var full = Path.GetFullPath(folder);
        Directory.CreateDirectory(full);
        var path = Path.Combine(full, LockFileName);
        FileStream stream;
        try
        {
            stream = new FileStream(path, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
        }
        catch (IOException ex) when (ex.HResult is SharingViolation or WouldBlock)
        {
            throw new FolderInUseException(full,
                $"The {role} folder '{full}' is in use by another monitor ({ReadHolder(full)}); one service writes a folder at a time. " +
                "Stop that instance first, or give this one its own ExposureLog:Folder and Journal:Folder.", ex);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new FolderInUseException(full, $"The {role} folder's lock file '{path}' cannot be opened ({ex.Message}); the service needs to create and lock it.", ex);
        }

        try
        {
            var holder = Encoding.UTF8.GetBytes(HolderText());
            stream.SetLength(0);
            stream.Write(holder);
            stream.Flush(flushToDisk: true);
            File.WriteAllBytes(Path.Combine(full, HolderFileName), holder);
        }
        catch (IOException)
        {
            // Only the lock counts; a full disk that refuses the holder's note is reported by the first real write.
        }
        return new FolderWriterLock(full, stream);
    }

    public void Dispose() => _lock.Dispose();

    private static string HolderText()
    {
        using var process = Process.GetCurrentProcess();
        var started = new DateTimeOffset(process.StartTime.ToUniversalTime(), TimeSpan.Zero).ToString("O", CultureInfo.InvariantCulture);
        return $$"""{"pid":{{Environment.ProcessId}},"startedAt":"{{started}}","host":"{{Environment.MachineName}}"}""" + "\n";
    }

    private static string ReadHolder(string folder)
    {
        try
        {
            return "holder " + File.ReadAllText(Path.Combine(folder, HolderFileName)).Trim();
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return "holder unknown: " + HolderFileName + " unreadable";
        }
    }
}
