namespace Monitor.Cli.Verbs;

/// <summary>
/// Input a verb cannot use, other than a malformed file (that is a <see cref="Files.Csv.CsvFileException"/>):
/// a bad option value (exit <see cref="BadOption"/>) or data the analytics refuse (exit <see cref="BadData"/>).
/// The message names the option or field and the value.
/// </summary>
internal sealed class CliInputException : Exception
{
    /// <summary>Exit code of a bad option value (as System.CommandLine's own parse errors).</summary>
    public const int BadOption = 1;

    /// <summary>Exit code of an unusable input file or data.</summary>
    public const int BadData = 2;

    public CliInputException(string message, int exitCode)
        : base(message)
    {
        ExitCode = exitCode;
    }

    public CliInputException()
    {
        ExitCode = BadData;
    }

    public CliInputException(string message)
        : this(message, BadData)
    {
    }

    public CliInputException(string message, Exception innerException)
        : base(message, innerException)
    {
        ExitCode = BadData;
    }

    public int ExitCode { get; }

    /// <summary>"--name is required and missing; it wants: what" (exit 1), as <see cref="CommonOptions.CheckRequired"/> words it.</summary>
    public static CliInputException Missing(string option, string wants) =>
        new($"{option} is required and missing; it wants: {wants}", BadOption);

    /// <summary>"--name: 'value' reason".</summary>
    public static CliInputException Option(string option, string? value, string reason) =>
        new($"{option}: '{value}' {reason}", BadOption);
}
