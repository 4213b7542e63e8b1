using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;

namespace Monitor.Files.Csv;

/// <summary>
/// Reads a comma-separated file with a header row (CsvHelper does the tokenising: quotes, escapes),
/// checks the required columns are present and refuses any column the format does not have (in the header, or a
/// row with more fields than the header), naming the file and line, and hands out rows whose typed getters fail with a
/// <see cref="CsvFileException"/> naming the file, line, column and value.
/// Lines starting with '#' are comments; blank lines are skipped.
/// </summary>
public static class CsvTable
{
    public static IEnumerable<CsvRow> Read(TextReader reader, string fileName, IReadOnlyCollection<string> requiredColumns, IReadOnlyCollection<string> optionalColumns)
    {
        ArgumentNullException.ThrowIfNull(optionalColumns);
        ArgumentNullException.ThrowIfNull(reader);
        var config = new CsvConfiguration(CultureInfo.InvariantCulture)
        {
            AllowComments = true,
            Comment = '#',
            IgnoreBlankLines = true,
            TrimOptions = TrimOptions.Trim,
            DetectColumnCountChanges = false,
            BadDataFound = null,
        };
        using var csv = new CsvReader(reader, config);
        if (!csv.Read() || !csv.ReadHeader() || csv.HeaderRecord is null)
        {
            throw new CsvFileException(fileName, 0, null, null, "is empty: a header row is required.");
        }
        var header = csv.HeaderRecord.Select(h => h.Trim().ToLowerInvariant()).ToArray();
        var missing = requiredColumns.Where(c => !header.Contains(c, StringComparer.Ordinal)).ToArray();
        if (missing.Length > 0)
        {
            throw new CsvFileException(fileName, 1, null, null,
                $"lacks the column(s) {string.Join(", ", missing)}; the header must include {string.Join(",", requiredColumns)}.");
        }
        var known = requiredColumns.Concat(optionalColumns).ToArray();
        if (header.FirstOrDefault(h => !known.Contains(h, StringComparer.Ordinal)) is { } extra)
        {
            throw new CsvFileException(fileName, csv.Parser.RawRow, extra, null,
                $"is not a column of this file; its columns are {string.Join(",", known)}.");
        }
        var index = header.Select((h, i) => (h, i)).GroupBy(p => p.h, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.First().i, StringComparer.Ordinal);
        while (csv.Read())
        {
            if (csv.Parser.Count > header.Length)
            {
                throw new CsvFileException(fileName, csv.Parser.RawRow, null, null,
                    $"has {csv.Parser.Count} fields but the header has {header.Length} columns: an extra field is refused.");
            }
            var fields = new string[header.Length];
            for (var i = 0; i < header.Length; i++)
            {
                fields[i] = csv.TryGetField<string>(i, out var f) && f is not null ? f : string.Empty;
            }
            yield return new CsvRow(fileName, csv.Parser.RawRow, index, fields);
        }
    }
}
