using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Contracts.V1;
using Monitor.Service.Audit;
using Monitor.Service.Storage;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Cuts checkpoints of the exposure log: the end of the chain (day, seq, mac, records that day) written to the
/// checkpoint folder outside the log folder (fsynced, through the storage gate as store <see cref="Store"/>) and
/// published as <see cref="ExposureLogCheckpointed"/> through the <see cref="EventOutbox"/>. Called every
/// <see cref="RecordOptions.CheckpointInterval"/> by <see cref="CheckpointWorker"/>, at the service's stop, and by the
/// business day's close (<c>WriteCheckpointAsync("day-close")</c>).
/// </summary>
public sealed partial class ExposureLogCheckpointer(
    ExposureLogWriter log, RecordKey key, IOptions<RecordOptions> record, IOptions<ExposureLogOptions> logOptions,
    StorageFaultGate storage, EventOutbox outbox, TimeProvider time, ILogger<ExposureLogCheckpointer> logger)
{
    /// <summary>Store name of the checkpoint folder in the storage gate and its health data.</summary>
    public const string Store = "checkpoints";

    /// <summary>Reason of the checkpoints cut every interval.</summary>
    public const string Interval = "interval";

    /// <summary>Reason of the checkpoint cut when the service stops.</summary>
    public const string Stop = "stop";

    /// <summary>Reason of the checkpoint the business day's close cuts.</summary>
    public const string DayClose = "day-close";

    private readonly SemaphoreSlim _one = new(1, 1);
    private long _lastSeq = -1;

    /// <summary>The checkpoint folder in use.</summary>
    public string Folder { get; } = record.Value.CheckpointFolderFor(logOptions.Value.Folder);

    /// <summary>
    /// Writes a checkpoint of the log as it stands and publishes it; returns it, or null when the log is empty or
    /// (for <see cref="Interval"/>) nothing was written since the previous checkpoint.
    /// </summary>
    public async Task<ExposureLogCheckpoint?> WriteCheckpointAsync(string reason, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(reason);
        await _one.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            if (log.Anchor() is not { } anchor || (reason == Interval && anchor.Seq == _lastSeq))
            {
                return null;
            }
            var checkpoint = new ExposureLogCheckpoint(anchor.Day, anchor.Seq, anchor.Mac, anchor.DayRecords, time.GetUtcNow(), reason);
            await storage.RunAsync(Store, () => ExposureLogCheckpointFiles.Append(Folder, key, checkpoint), cancellationToken).ConfigureAwait(false);
            _lastSeq = anchor.Seq;
            var message = new ExposureLogCheckpointed
            {
                Day = checkpoint.Day,
                Seq = checkpoint.Seq,
                Mac = checkpoint.Mac,
                DayRecords = checkpoint.DayRecords,
                Reason = checkpoint.Reason,
                CheckpointMac = checkpoint.MacUnder(key),
                CheckpointedAt = checkpoint.Time,
            };
            await outbox.EnqueueAsync([message], [], cancellationToken).ConfigureAwait(false);
            LogCheckpoint(reason, checkpoint.Day, checkpoint.Seq, Folder);
            return checkpoint;
        }
        finally
        {
            _one.Release();
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Exposure log checkpoint ({Reason}): day {Day:yyyy-MM-dd}, seq {Seq}, written to {Folder}")]
    private partial void LogCheckpoint(string reason, DateOnly day, long seq, string folder);
}
