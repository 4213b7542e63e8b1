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
    /// Fixed offset from UTC that defines the business day: a record goes into the file of the date of
    /// (written time in UTC + offset). Zero = UTC days. A fixed offset, not a time zone: no daylight
    /// saving shifts (the trap: a DST zone needs its offset changed by configuration twice a year).
    /// </summary>
    public TimeSpan BusinessDayUtcOffset { get; set; } = TimeSpan.Zero;

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

        if (BusinessDayUtcOffset < TimeSpan.FromHours(-14) || BusinessDayUtcOffset > TimeSpan.FromHours(14)
            || BusinessDayUtcOffset.Ticks % TimeSpan.TicksPerMinute != 0)
        {
            errors.Add($"{SectionName}:{nameof(BusinessDayUtcOffset)} is {BusinessDayUtcOffset}: use whole minutes between -14:00:00 and 14:00:00 (e.g. \"-05:00:00\").");
        }

        return errors;
    }
}
