namespace Monitor.Service.Storage;

/// <summary>
/// The record key and the checkpoints of the exposure log (configuration section <see cref="SectionName"/>).
/// </summary>
public sealed class RecordOptions
{
    /// <summary>The configuration section these options bind from.</summary>
    public const string SectionName = "Record";

    /// <summary>
    /// Path of a secret file holding the record key (at least 32 characters); when empty the key is read from the
    /// environment variable <see cref="RecordKey.Variable"/>. Never inside the exposure log, journal or checkpoint folders.
    /// </summary>
    public string? KeyFile { get; set; }

    /// <summary>How often a checkpoint of the exposure log is written (business clock). Default 5 minutes.</summary>
    public TimeSpan CheckpointInterval { get; set; } = TimeSpan.FromMinutes(5);

    /// <summary>
    /// Folder of the checkpoint files, outside the exposure log and journal folders. Empty: beside the log,
    /// <c>&lt;ExposureLog:Folder&gt;-checkpoints</c>.
    /// </summary>
    public string CheckpointFolder { get; set; } = string.Empty;

    /// <summary>The checkpoint folder for a log folder: the configured one, or <c>&lt;log folder&gt;-checkpoints</c>.</summary>
    public string CheckpointFolderFor(string logFolder) =>
        string.IsNullOrWhiteSpace(CheckpointFolder) ? logFolder.TrimEnd('/', '\\') + "-checkpoints" : CheckpointFolder;

    /// <summary>True when <paramref name="path"/> is <paramref name="folder"/> or lies under it (full paths, ordinal).</summary>
    public static bool IsInside(string path, string folder)
    {
        var full = Path.GetFullPath(path).TrimEnd('/', '\\');
        var root = Path.GetFullPath(folder).TrimEnd('/', '\\');
        return string.Equals(full, root, StringComparison.Ordinal)
            || full.StartsWith(root + Path.DirectorySeparatorChar, StringComparison.Ordinal);
    }
}
