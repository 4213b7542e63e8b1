namespace Monitor.Service.Audit;

/// <summary>
/// Wraps the day file's stream so that every flush (the audit file sink flushes after each event)
/// also asks the operating system to put the bytes on the disk (fsync via FileStream.Flush(true)),
/// unless <see cref="DiskFlushControl.Deferred"/> is set: then a batch of records is put on the disk once,
/// by <see cref="FlushToDisk"/> at its end (or when the file is closed).
/// </summary>
internal sealed class FlushToDiskStream(Stream inner, DiskFlushControl control) : Stream
{
    private bool _unsynced;

    public override bool CanRead => false;

    public override bool CanSeek => false;

    public override bool CanWrite => inner.CanWrite;

    public override long Length => inner.Length;

    public override long Position
    {
        get => inner.Position;
        set => throw new NotSupportedException();
    }

    public override void Flush()
    {
        inner.Flush();
        if (control.Deferred)
        {
            _unsynced = true;
        }
        else
        {
            FlushToDisk();
        }
    }

    /// <summary>Puts everything written so far on the disk.</summary>
    public void FlushToDisk()
    {
        if (inner is FileStream file)
        {
            file.Flush(flushToDisk: true);
        }
        _unsynced = false;
    }

    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => inner.Write(buffer, offset, count);

    public override void Write(ReadOnlySpan<byte> buffer) => inner.Write(buffer);

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            try
            {
                if (_unsynced)
                {
                    FlushToDisk(); // a day file closed in the middle of a batch keeps its records
                }
            }
            finally
            {
                inner.Dispose();
            }
        }

        base.Dispose(disposing);
    }
}
