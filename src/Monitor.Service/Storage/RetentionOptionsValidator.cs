using Microsoft.Extensions.Options;

namespace Monitor.Service.Storage;

/// <summary>Checks the <c>Retention</c> section at start-up against the folders it archives from; each failure names the key and the fix.</summary>
public sealed class RetentionOptionsValidator(Func<(string LogFolder, string JournalFolder)> folders) : IValidateOptions<RetentionOptions>
{
    public ValidateOptionsResult Validate(string? name, RetentionOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var failures = new List<string>();
        if (options.DaysKept is < 1 or > RetentionOptions.MostDaysKept)
        {
            failures.Add($"Retention:DaysKept: {options.DaysKept} is outside 1..{RetentionOptions.MostDaysKept}; use 30 (the current business day counts as one).");
        }
        if (string.IsNullOrWhiteSpace(options.ArchiveFolder))
        {
            failures.Add("Retention:ArchiveFolder: is blank; name a folder outside the exposure log and journal folders, e.g. /var/lib/monitor/archive.");
        }
        else
        {
            var (logFolder, journalFolder) = folders();
            var archive = Full(options.ArchiveFolder);
            foreach (var (key, folder) in new[] { ("ExposureLog:Folder", logFolder), ("Journal:Folder", journalFolder) })
            {
                var full = Full(folder);
                if (Within(archive, full) || Within(full, archive))
                {
                    failures.Add($"Retention:ArchiveFolder: '{options.ArchiveFolder}' overlaps {key} '{folder}'; archived days must leave the folder they were in: name a folder beside it, e.g. '{folder.TrimEnd('/', '\\')}-archive'.");
                }
            }
        }
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }

    private static string Full(string folder) => Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder));

    private static bool Within(string inner, string outer) =>
        inner.Equals(outer, StringComparison.Ordinal) || inner.StartsWith(outer + Path.DirectorySeparatorChar, StringComparison.Ordinal);
}
