using System.Globalization;

namespace Monitor.Service.Audit;

/// <summary>Day file naming: <c>exposures-yyyy-MM-dd.jsonl</c>, one per business day.</summary>
internal static class ExposureLogFiles
{
    private const string Prefix = "exposures-";
    private const string Suffix = ".jsonl";
    private const string DayFormat = "yyyy-MM-dd";

    public static string FileName(DateOnly day) => Prefix + day.ToString(DayFormat, CultureInfo.InvariantCulture) + Suffix;

    public static string PathOf(string folder, DateOnly day) => Path.Combine(folder, FileName(day));

    public static bool TryParseDay(string fileName, out DateOnly day)
    {
        day = default;
        return fileName.StartsWith(Prefix, StringComparison.Ordinal)
            && fileName.EndsWith(Suffix, StringComparison.Ordinal)
            && DateOnly.TryParseExact(
                fileName[Prefix.Length..^Suffix.Length], DayFormat, CultureInfo.InvariantCulture, DateTimeStyles.None, out day);
    }

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
            if (TryParseDay(Path.GetFileName(path), out var day))
            {
                files.Add((day, path));
            }
        }

        files.Sort((a, b) => a.Day.CompareTo(b.Day));
        return files;
    }
}
