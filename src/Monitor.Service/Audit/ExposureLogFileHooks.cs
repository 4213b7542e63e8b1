using System.Text;
using Serilog.Sinks.File;

namespace Monitor.Service.Audit;

/// <summary>
/// Serilog file hooks of the exposure log: flush to disk on every flush when asked, and an optional
/// stream decorator (tests use it to inject a write failure in the middle of a line).
/// </summary>
internal sealed class ExposureLogFileHooks(bool flushToDisk, Func<Stream, Stream>? decorator) : FileLifecycleHooks
{
    public override Stream OnFileOpened(string path, Stream underlyingStream, Encoding encoding)
    {
        var stream = flushToDisk ? new FlushToDiskStream(underlyingStream) : underlyingStream;
        return decorator is null ? stream : decorator(stream);
    }
}
