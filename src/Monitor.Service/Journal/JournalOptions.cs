namespace Monitor.Service.Journal;

/// <summary>Where and how the trade journal writes (configuration section <c>Journal</c>).</summary>
public sealed class JournalOptions
{
    public const string SectionName = "Journal";

    /// <summary>Folder of the day files <c>journal-yyyy-MM-dd.jsonl</c>. Required.</summary>
    public string Folder { get; set; } = string.Empty;

    /// <summary>
    /// Fixed offset added to the writer's UTC clock to find the business day of a record (a fixed offset,
    /// not a time zone: no daylight-saving shift). Default zero: UTC days.
    /// </summary>
    public TimeSpan BusinessDayUtcOffset { get; set; } = TimeSpan.Zero;

    /// <summary>
    /// Start although today's journal has lines failing their check or the books miss trades the exposure log records
    /// as applied: each such loss is written to the exposure log as a <c>journal-loss</c> record and logged as an error.
    /// Default false (the start is refused). Set it for one start only, after moving the bad file aside (Journal/README.md).
    /// </summary>
    public bool AcceptLoss { get; set; }

    /// <summary>Most records written between two flushes (one fsync per batch). Default 512.</summary>
    public int MaxBatch { get; set; } = 512;
}
