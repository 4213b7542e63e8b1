namespace Monitor.Service.Audit;

/// <summary>What is wrong with a line of the exposure log, or between the log and its checkpoints.</summary>
public enum ExposureLogProblemKind
{
    /// <summary>Not a record: invalid JSON, a missing or mistyped member, members out of order.</summary>
    Unparsable,

    /// <summary>The last line of a file has no line feed: a write cut short (crash or full disk).</summary>
    TornLine,

    /// <summary>The stored mac is not the HMAC-SHA256 of the record under the key: the line was written or changed without the key.</summary>
    MacMismatch,

    /// <summary>prevMac is not the mac of the record before it: a record was removed, inserted or moved.</summary>
    BrokenLink,

    /// <summary>seq is not one more than the record before it: a record was removed, duplicated or moved.</summary>
    SequenceGap,

    /// <summary>The day file asked for does not exist.</summary>
    MissingFile,

    /// <summary>A checkpoint line is unparsable or fails its checkpointMac under the key: it cannot anchor anything.</summary>
    CheckpointUnverifiable,

    /// <summary>A checkpoint names a day whose file is not in the log folder: the day file was deleted.</summary>
    DayFileMissing,

    /// <summary>A checkpoint names a seq beyond the log's last record: records were cut off the end.</summary>
    TailCut,

    /// <summary>The record at a checkpoint's seq has another mac, day or position than the checkpoint says: the log was rewritten from before it.</summary>
    CheckpointMismatch,
}
