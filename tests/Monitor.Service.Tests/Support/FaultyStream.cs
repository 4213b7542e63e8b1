namespace Monitor.Service.Tests.Support;

/// <summary>
/// Passes writes through until <see cref="Fail"/> is set; then writes half of the next buffer and
/// throws the IOException a full disk gives ("No space left on device"), leaving a torn line.
/// </summary>
public sealed class FaultyStream(Stream inner, Func<bool> fail) : Stream
{
    public override bool CanRead => false;

    public override bool CanSeek => false;

    public override bool CanWrite => true;

    public override long Length => inner.Length;

    public override long Position
    {
        get => inner.Position;
        set => throw new NotSupportedException();
    }

    public override void Flush() => inner.Flush();

    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    public override void Write(ReadOnlySpan<byte> buffer)
    {
        if (fail())
        {
            inner.Write(buffer[..(buffer.Length / 2)]);
            inner.Flush();
            throw new IOException("No space left on device (simulated)");
        }

        inner.Write(buffer);
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            inner.Dispose();
        }

        base.Dispose(disposing);
    }
}
