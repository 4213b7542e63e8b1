using System.Globalization;

namespace Monitor.Files.Csv;

/// <summary>One data row with typed, validating getters. Numbers use the invariant culture ('.' decimal point).</summary>
public sealed class CsvRow
{
    private readonly IReadOnlyDictionary<string, int> _index;
    private readonly string[] _fields;

    internal CsvRow(string file, int line, IReadOnlyDictionary<string, int> index, string[] fields)
    {
        File = file;
        Line = line;
        _index = index;
        _fields = fields;
    }

    public string File { get; }

    /// <summary>1-based physical line of the row in the file.</summary>
    public int Line { get; }

    /// <summary>The raw text of a column, or "" when the column is absent or blank.</summary>
    public string Raw(string column) => _index.TryGetValue(column, out var i) ? _fields[i] : string.Empty;

    public bool IsBlank(string column) => Raw(column).Length == 0;

    public string RequiredText(string column)
    {
        var value = Raw(column);
        return value.Length > 0 ? value : throw Error(column, value, "is blank: a value is required.");
    }

    public string? OptionalText(string column)
    {
        var value = Raw(column);
        return value.Length > 0 ? value : null;
    }

    public double RequiredNumber(string column) =>
        OptionalNumber(column) ?? throw Error(column, string.Empty, "is blank: a number is required.");

    public double? OptionalNumber(string column)
    {
        var value = Raw(column);
        if (value.Length == 0)
        {
            return null;
        }
        if (!double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out var number) || !double.IsFinite(number))
        {
            throw Error(column, value, "is not a finite number (use digits with '.' as the decimal point).");
        }
        return number;
    }

    public int RequiredInteger(string column)
    {
        var value = RequiredText(column);
        return int.TryParse(value, NumberStyles.Integer, CultureInfo.InvariantCulture, out var number)
            ? number
            : throw Error(column, value, "is not a whole number.");
    }

    public DateOnly RequiredDate(string column) =>
        OptionalDate(column) ?? throw Error(column, string.Empty, "is blank: a date (YYYY-MM-DD) is required.");

    public DateOnly? OptionalDate(string column)
    {
        var value = Raw(column);
        if (value.Length == 0)
        {
            return null;
        }
        return DateOnly.TryParseExact(value, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date)
            ? date
            : throw Error(column, value, "is not a date in the form YYYY-MM-DD.");
    }

    /// <summary>
    /// ISO 8601 extended form only, date then <c>T</c> then time, optional fraction and <c>Z</c> or an offset (UTC when
    /// none): a culture-dependent parse read <c>01/06/2026 16:30</c> as 6 January without a word.
    /// </summary>
    private static readonly string[] TimestampFormats =
        ["yyyy-MM-dd'T'HH:mmK", "yyyy-MM-dd'T'HH:mm:ssK", "yyyy-MM-dd'T'HH:mm:ss.FFFFFFFK"];

    public DateTimeOffset RequiredTimestamp(string column)
    {
        var value = RequiredText(column);
        return DateTimeOffset.TryParseExact(value, TimestampFormats, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal, out var time)
            ? time
            : throw Error(column, value, "is not an ISO 8601 timestamp (YYYY-MM-DDTHH:MM[:SS[.fff]], then Z or an offset such as +01:00; UTC if none), e.g. 2026-03-02T14:30:00Z.");
    }

    /// <summary>An error about one field of this row.</summary>
    public CsvFileException Error(string column, string? value, string reason) => new(File, Line, column, value, reason);
}
