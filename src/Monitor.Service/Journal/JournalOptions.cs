namespace Monitor.Service.Journal;

/// <summary>Where and how the trade journal writes (configuration section <c>Journal</c>).</summary>
public sealed class JournalOptions
{
    public const string SectionName = "Journal";

    /// <summary>Folder of the day files <c>journal-yyyy-MM-dd.jsonl</c>. Required.</summary>
    public string Folder { get; set; } = string.Empty;

    /// <summary>Most records written between two flushes (one fsync per batch). Default 512.</summary>
    public int MaxBatch { get; set; } = 512;
}
