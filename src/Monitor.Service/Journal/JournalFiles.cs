using System.Globalization;

namespace Monitor.Service.Journal;

/// <summary>Names of the journal's day files: <c>journal-yyyy-MM-dd.jsonl</c>, one per business date.</summary>
public static class JournalFiles
{
    private const string Prefix = "journal-";
    private const string Suffix = ".jsonl";
    private const string DayFormat = "yyyy-MM-dd";

    public static string FileName(DateOnly day) => Prefix + day.ToString(DayFormat, CultureInfo.InvariantCulture) + Suffix;

    public static string PathOf(string folder, DateOnly day) => Path.Combine(folder, FileName(day));

    /// <summary>Day files in the folder, oldest first; empty when the folder does not exist.</summary>
    public static IReadOnlyList<(DateOnly Day, string Path)> List(string folder)
    {
        if (!Directory.Exists(folder))
        {
            return [];
        }
        var files = new List<(DateOnly Day, string Path)>();
        foreach (var path in Directory.EnumerateFiles(folder, Prefix + "*" + Suffix))
        {
            var name = Path.GetFileName(path);
            if (DateOnly.TryParseExact(name[Prefix.Length..^Suffix.Length], DayFormat, CultureInfo.InvariantCulture, DateTimeStyles.None, out var day))
            {
                files.Add((day, path));
            }
        }
        files.Sort((a, b) => a.Day.CompareTo(b.Day));
        return files;
    }
}
