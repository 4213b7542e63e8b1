namespace Monitor.Service.Journal;

/// <summary>Where and how the trade journal writes (configuration section <c>Journal</c>).</summary>
public sealed class JournalOptions
{
    public const string SectionName = "Journal";

    /// <summary>Folder of the day files <c>journal-yyyy-MM-dd.jsonl</c>. Required.</summary>
    public string Folder { get; set; } = string.Empty;

    /// <summary>
    /// Start although a replayed journal day has lines failing their check or the books miss trades the exposure log
    /// records as applied: each such loss is written to the exposure log as a <c>journal-loss</c> record and logged as an
    /// error. Default false (the start is refused). Set it for one start only, after moving the bad file aside (Journal/README.md).
    /// </summary>
    public bool AcceptLoss { get; set; }

    /// <summary>Most records written between two flushes (one fsync per batch). Default 512.</summary>
    public int MaxBatch { get; set; } = 512;
}
