using System.Text;
using Serilog.Sinks.File;

namespace Monitor.Service.Audit;

/// <summary>
/// Serilog file hooks of the exposure log: flush to disk on every flush when asked (or once per batch, see
/// <see cref="DiskFlushControl"/>), and an optional stream decorator (tests use it to inject a write failure in the
/// middle of a line).
/// </summary>
internal sealed class ExposureLogFileHooks(bool flushToDisk, Func<Stream, Stream>? decorator, DiskFlushControl control) : FileLifecycleHooks
{
    public override Stream OnFileOpened(string path, Stream underlyingStream, Encoding encoding)
    {
        Stream stream = underlyingStream;
        if (flushToDisk)
        {
            var synced = new FlushToDiskStream(underlyingStream, control);
            control.Current = synced;
            stream = synced;
        }
        return decorator is null ? stream : decorator(stream);
    }
}
