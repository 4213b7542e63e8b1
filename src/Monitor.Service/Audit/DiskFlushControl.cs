namespace Monitor.Service.Audit;

/// <summary>
/// Shared between the exposure-log writer and the day file's <see cref="FlushToDiskStream"/>: while a batch is written,
/// the per-record fsync is deferred, and the batch ends with one fsync of the file it was written to.
/// </summary>
internal sealed class DiskFlushControl
{
    public bool Deferred { get; set; }

    /// <summary>The stream of the day file open now, if the log flushes to disk.</summary>
    public FlushToDiskStream? Current { get; set; }

    public void FlushCurrent() => Current?.FlushToDisk();
}
