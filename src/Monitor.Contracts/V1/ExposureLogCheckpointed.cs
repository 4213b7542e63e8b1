namespace Monitor.Contracts.V1;

/// <summary>
/// Outbound: a checkpoint of the exposure log was cut, so an archive elsewhere can hold the anchor. Wire identity:
/// <c>Monitor.Contracts.V1.ExposureLogCheckpointed</c>.
/// </summary>
public sealed record ExposureLogCheckpointed
{
    /// <summary>Business day (day file) of the record anchored.</summary>
    public required DateOnly Day { get; init; }

    /// <summary>seq of the last record of the log when the checkpoint was cut.</summary>
    public required long Seq { get; init; }

    /// <summary>mac (HMAC-SHA256, 64 lowercase hex) of that record.</summary>
    public required string Mac { get; init; }

    /// <summary>Records in that day file up to and including <see cref="Seq"/>.</summary>
    public required long DayRecords { get; init; }

    /// <summary><c>interval</c>, <c>day-close</c> or <c>stop</c>.</summary>
    public required string Reason { get; init; }

    /// <summary>HMAC-SHA256 of the checkpoint line under the record key (the line in the checkpoint file).</summary>
    public required string CheckpointMac { get; init; }

    /// <summary>When the checkpoint was cut (the service's clock).</summary>
    public required DateTimeOffset CheckpointedAt { get; init; }
}
