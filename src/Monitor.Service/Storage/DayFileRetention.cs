using System.Globalization;
using Microsoft.Extensions.Logging;

namespace Monitor.Service.Storage;

/// <summary>
/// Keeps the newest <see cref="RetentionOptions.DaysKept"/> business days of exposure-log (<c>exposures-*.jsonl</c>) and
/// journal (<c>journal-*.jsonl</c>) day files in their folders and moves older days, both files of a day together, to
/// <c>&lt;ArchiveFolder&gt;/exposure-log</c> and <c>&lt;ArchiveFolder&gt;/journal</c>. Nothing is deleted or overwritten:
/// the current day, any day after it, and any day <see cref="IClosedDays"/> does not vouch for stay where they are (with
/// a warning), and a file whose name is already in the archive stays too (an error: someone must compare the two).
/// Run at start (<see cref="RetentionAtStart"/>) and at each business-day roll: call <see cref="Apply"/> with the new day.
/// </summary>
public sealed partial class DayFileRetention(RetentionOptions options, string exposureLogFolder, string journalFolder, IClosedDays closedDays, ILogger<DayFileRetention> logger)
{
    private const string LogPrefix = "exposures-";
    private const string JournalPrefix = "journal-";
    private const string Suffix = ".jsonl";
    private readonly Lock _lock = new();

    public RetentionOutcome Apply(DateOnly currentDay)
    {
        lock (_lock)
        {
            var logFiles = DayFiles(exposureLogFolder, LogPrefix);
            var journalFiles = DayFiles(journalFolder, JournalPrefix);
            var days = logFiles.Keys.Union(journalFiles.Keys).OrderDescending().ToList();
            // The newest DaysKept days with files stay (the current day among them when it has files); never the current day or later.
            var older = days.Skip(options.DaysKept).Where(d => d < currentDay).OrderBy(d => d).ToList();
            var moved = new List<(string, string)>();
            var kept = new List<(DateOnly, string)>();
            foreach (var day in older)
            {
                if (!closedDays.IsClosed(day, out var why))
                {
                    LogKeptOpen(day, why);
                    kept.Add((day, why));
                    continue;
                }
                var files = new List<(string From, string To)>();
                if (logFiles.TryGetValue(day, out var log))
                {
                    files.Add((log, Path.Combine(options.ArchiveFolder, "exposure-log", Path.GetFileName(log))));
                }
                if (journalFiles.TryGetValue(day, out var journal))
                {
                    files.Add((journal, Path.Combine(options.ArchiveFolder, "journal", Path.GetFileName(journal))));
                }
                if (files.FirstOrDefault(f => File.Exists(f.To)) is { To: not null } clash)
                {
                    var reason = $"'{clash.To}' is already in the archive; compare it with '{clash.From}' and remove one by hand";
                    LogArchiveClash(day, reason);
                    kept.Add((day, reason));
                    continue;
                }
                foreach (var (from, to) in files)
                {
                    Directory.CreateDirectory(Path.GetDirectoryName(to)!);
                    File.Move(from, to, overwrite: false);
                    LogMoved(from, to);
                    moved.Add((from, to));
                }
            }
            return new RetentionOutcome(moved, kept);
        }
    }

    private static Dictionary<DateOnly, string> DayFiles(string folder, string prefix)
    {
        var files = new Dictionary<DateOnly, string>();
        if (!Directory.Exists(folder))
        {
            return files;
        }
        foreach (var path in Directory.EnumerateFiles(folder, prefix + "*" + Suffix))
        {
            var name = Path.GetFileName(path);
            if (DateOnly.TryParseExact(name[prefix.Length..^Suffix.Length], "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var day))
            {
                files[day] = path;
            }
        }
        return files;
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Retention: moved {From} to {To}")]
    private partial void LogMoved(string from, string to);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Retention: business day {Day:yyyy-MM-dd} is older than the days kept but stays: it is not closed ({Why})")]
    private partial void LogKeptOpen(DateOnly day, string why);

    [LoggerMessage(Level = LogLevel.Error, Message = "Retention: business day {Day:yyyy-MM-dd} stays: {Reason}")]
    private partial void LogArchiveClash(DateOnly day, string reason);
}
