namespace Monitor.Service.Storage;

/// <summary>File lengths for the append-only files (exposure log, trade journal).</summary>
internal static class FileLength
{
    /// <summary>Length of the file's content, following symbolic links (FileInfo.Length gives the link's own length); 0 when missing.</summary>
    public static long Of(string path)
    {
        if (!File.Exists(path))
        {
            return 0;
        }
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite);
        return stream.Length;
    }
}
