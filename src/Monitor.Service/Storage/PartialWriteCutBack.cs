namespace Monitor.Service.Storage;

/// <summary>
/// Cuts an append-only file (exposure log, trade journal) back to its length after the last good record:
/// removes the partial line a failed write (full disk, crash) left, so that the retried record starts on a
/// line of its own and the file never holds a torn line between two good ones.
/// </summary>
internal static class PartialWriteCutBack
{
    /// <summary>Truncates to <paramref name="goodLength"/> and fsyncs; returns the bytes removed (empty when none).</summary>
    /// <exception cref="IOException">
    /// The file is shorter than <paramref name="goodLength"/>, or missing while records were written to it: records were
    /// removed behind the writer's back (the message names the path and both lengths). Also any I/O failure of the cut.
    /// </exception>
    public static byte[] CutBackTo(string path, long goodLength)
    {
        if (!File.Exists(path))
        {
            return goodLength == 0
                ? []
                : throw new IOException($"'{path}' is missing, but {goodLength} bytes of records were written to it.");
        }

        using var stream = new FileStream(path, FileMode.Open, FileAccess.ReadWrite, FileShare.Read);
        if (stream.Length < goodLength)
        {
            throw new IOException($"'{path}' is {stream.Length} bytes, shorter than the {goodLength} bytes of records written to it.");
        }

        if (stream.Length == goodLength)
        {
            return [];
        }

        var removed = new byte[stream.Length - goodLength];
        stream.Position = goodLength;
        stream.ReadExactly(removed);
        stream.SetLength(goodLength);
        stream.Flush(flushToDisk: true);
        return removed;
    }
}
