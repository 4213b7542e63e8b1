using System.CommandLine;
using Monitor.Files.Csv;

namespace Monitor.Cli.Verbs;

/// <summary>
/// Runs a verb's body against the invocation's output and error writers and maps failures to exit codes:
/// 0 done, 1 bad option value, 2 bad input file or data (the message names file, line, column and value), and
/// whatever the body returns otherwise (fit: 4 when a curve fails its quality gate).
/// </summary>
internal static class VerbRunner
{
    /// <summary>Exit code of a fit whose curve failed the quality gate.</summary>
    public const int GateFailed = 4;

    public static int Run(ParseResult parse, Func<TextWriter, int> body)
    {
        var error = parse.InvocationConfiguration.Error;
        try
        {
            return body(parse.InvocationConfiguration.Output);
        }
        catch (CsvFileException ex)
        {
            error.WriteLine(ex.Message);
            return CliInputException.BadData;
        }
        catch (CliInputException ex)
        {
            error.WriteLine(ex.Message);
            return ex.ExitCode;
        }
    }
}
