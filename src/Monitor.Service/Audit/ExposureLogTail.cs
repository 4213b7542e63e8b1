namespace Monitor.Service.Audit;

/// <summary>
/// The end of a day file: its last complete line (ended by a line feed) and any bytes after it
/// (a torn line: a write cut short). Read backwards in blocks, so the start-up cost does not grow with the file.
/// </summary>
/// <param name="FileLength">Length of the file in bytes.</param>
/// <param name="CompleteLength">Bytes up to and including the last line feed (0 when there is none).</param>
/// <param name="LastLine">The last complete line without its line feed, null when the file has none.</param>
/// <param name="Fragment">Bytes after the last line feed (empty when the file ends with one).</param>
internal sealed record ExposureLogTail(long FileLength, long CompleteLength, byte[]? LastLine, byte[] Fragment)
{
    private const int BlockSize = 64 * 1024;

    public static ExposureLogTail Read(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite);
        var length = stream.Length;
        var lastFeed = FindFeedBefore(stream, length);
        var completeLength = lastFeed + 1;
        var fragment = ReadRange(stream, completeLength, length);
        if (lastFeed < 0)
        {
            return new ExposureLogTail(length, 0, null, fragment);
        }

        var previousFeed = FindFeedBefore(stream, lastFeed);
        var lastLine = ReadRange(stream, previousFeed + 1, lastFeed);
        return new ExposureLogTail(length, completeLength, lastLine, fragment);
    }

    /// <summary>Offset of the last '\n' strictly before <paramref name="end"/>, or -1.</summary>
    private static long FindFeedBefore(FileStream stream, long end)
    {
        var block = new byte[BlockSize];
        var blockEnd = end;
        while (blockEnd > 0)
        {
            var blockStart = Math.Max(0, blockEnd - BlockSize);
            var count = (int)(blockEnd - blockStart);
            stream.Position = blockStart;
            stream.ReadExactly(block, 0, count);
            var index = block.AsSpan(0, count).LastIndexOf((byte)'\n');
            if (index >= 0)
            {
                return blockStart + index;
            }

            blockEnd = blockStart;
        }

        return -1;
    }

    private static byte[] ReadRange(FileStream stream, long start, long end)
    {
        var bytes = new byte[end - start];
        stream.Position = start;
        stream.ReadExactly(bytes);
        return bytes;
    }
}
