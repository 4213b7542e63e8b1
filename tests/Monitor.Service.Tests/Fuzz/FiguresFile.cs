using Xunit.Abstractions;

namespace Monitor.Service.Tests.Fuzz;

/// <summary>
/// The bad-input figures of the README's "Reliability" section: written to the test output and, when
/// MONITOR_FIGURES_FILE names a file, appended to it (`.ci/run` sets it and prints the file, so the CI log shows the
/// figures at the test logger's normal verbosity).
/// </summary>
internal static class FiguresFile
{
    public static void Report(ITestOutputHelper output, string line)
    {
        output.WriteLine(line);
        if (Environment.GetEnvironmentVariable("MONITOR_FIGURES_FILE") is { Length: > 0 } file)
        {
            File.AppendAllText(file, line + Environment.NewLine);
        }
    }
}
