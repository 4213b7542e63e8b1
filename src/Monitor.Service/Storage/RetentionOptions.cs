namespace Monitor.Service.Storage;

/// <summary>
/// How many business days of exposure-log and journal day files stay in their folders (configuration section
/// <c>Retention</c>); older closed days are moved to <see cref="ArchiveFolder"/>, never deleted.
/// </summary>
public sealed class RetentionOptions
{
    public const string SectionName = "Retention";

    public const int MostDaysKept = 3660;

    /// <summary>The newest business days (with files) that stay in the log and journal folders, the current one included. Default 30.</summary>
    public int DaysKept { get; set; } = 30;

    /// <summary>
    /// Where older days go: <c>exposure-log/</c> and <c>journal/</c> under it, file names unchanged. Default
    /// <c>&lt;ExposureLog:Folder&gt;-archive</c>. Must not be the log or journal folder nor inside either.
    /// </summary>
    public string ArchiveFolder { get; set; } = string.Empty;
}
