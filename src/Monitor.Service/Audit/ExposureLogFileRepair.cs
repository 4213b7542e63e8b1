namespace Monitor.Service.Audit;

/// <summary>
/// Cuts a day file back to the length it had after its last good record: removes the torn bytes a
/// failed write (full disk, crash) may have left, so the next line starts on a line of its own.
/// </summary>
internal static class ExposureLogFileRepair
{
    /// <summary>Truncates to <paramref name="goodLength"/>; returns the bytes removed (empty when none).</summary>
    /// <exception cref="IOException">The file is shorter than <paramref name="goodLength"/>: records were removed behind our back.</exception>
    public static byte[] TruncateTo(string path, long goodLength)
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
