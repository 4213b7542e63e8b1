using System.Globalization;

namespace Monitor.Service.Journal;

/// <summary>Names of the journal's day files: <c>journal-yyyy-MM-dd.jsonl</c>.</summary>
public static class JournalFiles
{
    public static string FileName(DateOnly day) => "journal-" + day.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + ".jsonl";

    public static string PathOf(string folder, DateOnly day) => Path.Combine(folder, FileName(day));

    /// <summary>The business day of a moment: its UTC date after adding the fixed offset.</summary>
    public static DateOnly DayOf(DateTimeOffset time, TimeSpan businessDayUtcOffset) =>
        DateOnly.FromDateTime(time.UtcDateTime + businessDayUtcOffset);
}
