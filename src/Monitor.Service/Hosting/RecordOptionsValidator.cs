using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Journal;
using Monitor.Service.Storage;

namespace Monitor.Service.Hosting;

/// <summary>
/// Checks the <c>Record</c> section at start-up: the key can be read (file or environment), and neither the key file
/// nor the checkpoint folder lies inside the exposure log or journal folders (whoever can write those could then
/// replace the key or the anchors). Each failure names the key and the fix.
/// </summary>
public sealed class RecordOptionsValidator(IOptions<ExposureLogOptions> log, IOptions<JournalOptions> journal, Func<string, string?> environment)
    : IValidateOptions<RecordOptions>
{
    public ValidateOptionsResult Validate(string? name, RecordOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var failures = new List<string>();
        var folders = new List<(string Key, string Folder)>();
        if (!string.IsNullOrWhiteSpace(log.Value.Folder))
        {
            folders.Add(("ExposureLog:Folder", log.Value.Folder));
        }
        if (!string.IsNullOrWhiteSpace(journal.Value.Folder))
        {
            folders.Add(("Journal:Folder", journal.Value.Folder));
        }
        var (_, problem) = RecordKey.Resolve(options.KeyFile, "Record:KeyFile", environment);
        if (problem is not null)
        {
            failures.Add(problem);
        }
        if (!string.IsNullOrWhiteSpace(options.KeyFile))
        {
            foreach (var (key, folder) in folders.Where(f => RecordOptions.IsInside(options.KeyFile, f.Folder)))
            {
                failures.Add($"Record:KeyFile '{options.KeyFile}' lies inside {key} '{folder}': whoever can write the records could replace the key. Keep the key file elsewhere (e.g. a mounted secret) or use {RecordKey.Variable}.");
            }
        }
        if (options.CheckpointInterval <= TimeSpan.Zero)
        {
            failures.Add($"Record:CheckpointInterval {options.CheckpointInterval} must be positive, e.g. 00:05:00.");
        }
        var checkpoints = options.CheckpointFolderFor(log.Value.Folder ?? string.Empty);
        foreach (var (key, folder) in folders.Where(f => RecordOptions.IsInside(checkpoints, f.Folder) || RecordOptions.IsInside(f.Folder, checkpoints)))
        {
            failures.Add($"Record:CheckpointFolder '{checkpoints}' overlaps {key} '{folder}': checkpoints anchor the log only from outside its folder. Set Record:CheckpointFolder to a folder of its own (ideally on another disk or host).");
        }
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }
}
