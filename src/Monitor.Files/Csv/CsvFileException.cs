namespace Monitor.Files.Csv;

/// <summary>
/// A file that does not follow its documented format. The message names the file, the line,
/// the column and the offending value, and says what was expected.
/// </summary>
public sealed class CsvFileException : Exception
{
    public CsvFileException(string file, int line, string? column, string? value, string reason)
        : base(Describe(file, line, column, value, reason))
    {
        File = file;
        Line = line;
        Column = column;
        Value = value;
        Reason = reason;
    }

    /// <summary>File name as given by the caller.</summary>
    public string File { get; }

    /// <summary>1-based line number in the file (the header is line 1); 0 when the whole file is at fault.</summary>
    public int Line { get; }

    /// <summary>Column name from the header, when one column is at fault.</summary>
    public string? Column { get; }

    /// <summary>The offending text as read.</summary>
    public string? Value { get; }

    public string Reason { get; }

    private static string Describe(string file, int line, string? column, string? value, string reason)
    {
        var where = line > 0 ? $"{file}, line {line}" : file;
        if (column is not null)
        {
            where += $", column '{column}'";
        }
        return value is null ? $"{where}: {reason}" : $"{where}: '{value}' {reason}";
    }
}
