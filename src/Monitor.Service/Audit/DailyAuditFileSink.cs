using System.Text;
using Serilog;
using Serilog.Core;
using Serilog.Events;
using Serilog.Sinks.File;

using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// Rolls the audit file per day: keeps one audit-mode Serilog file logger
/// (<c>AuditTo.File(formatter, path)</c>, which throws when a write fails) for the day file named by
/// the event, and switches to a new one when the day changes. Serilog's file sink does not roll in
/// audit mode, hence this sink.
/// After a failed write the logger is dropped (its buffers may hold part of the line) and, before
/// the next write, the file is cut back to its length after the last good record, so a torn line
/// never stays in the file.
/// </summary>
internal sealed class DailyAuditFileSink(FileLifecycleHooks? hooks) : ILogEventSink, IDisposable
{
    public const string FileProperty = "ExposureLogFile";

    private readonly Lock _gate = new();
    private readonly AuditLineFormatter _formatter = new();
    private Logger? _logger;
    private string? _path;
    private long _goodLength;
    private bool _needsRepair;

    public void Emit(LogEvent logEvent)
    {
        ArgumentNullException.ThrowIfNull(logEvent);
        var path = AuditLineFormatter.ReadString(logEvent, FileProperty);
        lock (_gate)
        {
            try
            {
                if (_logger is null || _needsRepair || !string.Equals(path, _path, StringComparison.Ordinal))
                {
                    Open(path);
                }

                _logger!.Write(logEvent);
                _goodLength += Encoding.UTF8.GetByteCount(AuditLineFormatter.ReadString(logEvent, AuditLineFormatter.LineProperty)) + 1;
            }
            catch
            {
                _needsRepair = true;
                CloseQuietly();
                throw;
            }
        }
    }

    public void Dispose()
    {
        lock (_gate)
        {
            CloseQuietly();
        }
    }

    private void Open(string path)
    {
        CloseQuietly();
        if (_needsRepair && _path is not null)
        {
            // The file of the failed write (maybe yesterday's) first: no torn line may stay behind.
            PartialWriteCutBack.CutBackTo(_path, _goodLength);
        }

        _needsRepair = false;
        if (!string.Equals(path, _path, StringComparison.Ordinal))
        {
            var length = FileLength.Of(path); // may throw: then _path still names the file repaired above
            _path = path;
            _goodLength = length;
        }

        _needsRepair = true; // until the logger is open
        _logger = new LoggerConfiguration()
            .MinimumLevel.Verbose()
            .AuditTo.File(_formatter, path, hooks: hooks)
            .CreateLogger();
        _needsRepair = false;
    }


    private void CloseQuietly()
    {
        var logger = _logger;
        _logger = null;
        try
        {
            logger?.Dispose();
        }
        catch (IOException)
        {
            // Disposing flushes what the failed write left in the buffers; the repair cuts it off again.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
