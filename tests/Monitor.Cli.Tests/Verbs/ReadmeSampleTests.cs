using System.Text.RegularExpressions;
using Monitor.Cli.Tests.Support;

namespace Monitor.Cli.Tests.Verbs;

/// <summary>
/// The samples in src/Monitor.Cli/README.md come from real runs: each sample's command (the backticked
/// `dotnet run --project src/Monitor.Cli -- ...` line before it) is run on copies of config/examples, and the sample's
/// lines must appear, in order and next to each other, in the real output. A change that moves a figure fails here;
/// paste the output the failure prints into the README.
/// </summary>
public partial class ReadmeSampleTests
{
    private static readonly string Examples = Path.Combine(AppContext.BaseDirectory, "Examples");

    public static TheoryData<string> Commands() => [.. Samples().Select(s => s.Command)];

    private static IEnumerable<(string Command, string[] Lines)> Samples()
    {
        var lines = File.ReadAllLines(Path.Combine(Examples, "CLI-README.md"));
        for (var i = 0; i < lines.Length; i++)
        {
            var command = SampleCommand().Match(lines[i]);
            if (!command.Success)
            {
                continue;
            }
            var open = Array.FindIndex(lines, i + 1, l => l.StartsWith("```", StringComparison.Ordinal));
            var close = Array.FindIndex(lines, open + 1, l => l.StartsWith("```", StringComparison.Ordinal));
            yield return (command.Groups[1].Value, lines[(open + 1)..close]);
            i = close;
        }
    }

    [Fact]
    public void The_readme_has_a_sample_of_each_analyst_verb()
    {
        var verbs = Samples().Select(s => s.Command.Split(' ')[0]).ToHashSet(StringComparer.Ordinal);
        Assert.Superset(new HashSet<string>(["fit", "risk", "explain", "bond", "curve"], StringComparer.Ordinal), verbs);
    }

    [Theory]
    [MemberData(nameof(Commands))]
    public void Sample_is_the_output_of_a_real_run(string command)
    {
        var sample = Samples().First(s => s.Command == command).Lines.Select(l => l.TrimEnd()).ToArray();
        var args = command.Split(' ', StringSplitOptions.RemoveEmptyEntries)
            .Select(a => a.StartsWith("config/examples/", StringComparison.Ordinal) ? Path.Combine(Examples, a["config/examples/".Length..]) : a)
            .ToArray();

        var (exit, output, error) = CliRun.Invoke(args);

        Assert.True(exit == 0, error);
        var actual = output.Replace("\r", string.Empty, StringComparison.Ordinal).Split('\n').Select(l => l.TrimEnd()).ToArray();
        var found = Enumerable.Range(0, Math.Max(0, actual.Length - sample.Length + 1)).Any(start => actual.AsSpan(start, sample.Length).SequenceEqual(sample));
        Assert.True(found, $"The README sample of `{command}` is not in the real output; the real output is:\n{output}");
    }

    [GeneratedRegex(@"^`dotnet run --project src/Monitor\.Cli -- ([^`]+)`")]
    private static partial Regex SampleCommand();
}
