namespace Monitor.Service.Audit;

/// <summary>
/// Settings of the exposure log (configuration section <see cref="SectionName"/>).
/// </summary>
public sealed class ExposureLogOptions
{
    /// <summary>The configuration section these options bind from.</summary>
    public const string SectionName = "ExposureLog";

    /// <summary>Folder holding the day files (<c>exposures-yyyy-MM-dd.jsonl</c>). Created on the first write.</summary>
    public string Folder { get; set; } = "exposure-log";

    /// <summary>
    /// When true (default) every record is flushed to the disk (fsync) before the append returns;
    /// when false it is flushed to the operating system only (survives a process crash, not a power cut).
    /// </summary>
    public bool FlushToDisk { get; set; } = true;

    /// <summary>Problems with these options, each naming the key and the fix; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (string.IsNullOrWhiteSpace(Folder))
        {
            errors.Add($"{SectionName}:{nameof(Folder)} is empty: set it to the folder that holds the exposure log day files.");
        }

        return errors;
    }
}
