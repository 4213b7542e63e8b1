using System.CommandLine;
using System.Globalization;
using Monitor.Service.Audit;

namespace Monitor.Cli.Verbs;

/// <summary><c>monitor verify-log FOLDER [--day YYYY-MM-DD]</c>: checks the exposure log's hash chain; exit 0 intact, 3 tampered or broken.</summary>
internal static class VerifyLogVerb
{
    public static Command Create()
    {
        var folder = new Argument<DirectoryInfo>("folder") { Description = "The exposure log folder (ExposureLog:Folder)." };
        var day = new Option<string?>("--day") { Description = "Verify only this business day (YYYY-MM-DD); default: every day in the folder." };
        var command = new Command("verify-log", "Verify an exposure log: recompute every hash, check the chain and the sequence.");
        command.Arguments.Add(folder);
        command.Options.Add(day);
        command.SetAction(parse =>
        {
            var dir = parse.GetValue(folder)!;
            var dayText = parse.GetValue(day);
            ExposureLogVerification result;
            if (dayText is null)
            {
                result = ExposureLogVerifier.VerifyFolder(dir.FullName);
            }
            else if (DateOnly.TryParseExact(dayText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d))
            {
                result = ExposureLogVerifier.VerifyDay(dir.FullName, d);
            }
            else
            {
                Console.Error.WriteLine($"--day: '{dayText}' is not a date in the form YYYY-MM-DD.");
                return 2;
            }
            Console.WriteLine(result.Intact
                ? $"intact: {result.Records} records, seq {result.FirstSeq}..{result.LastSeq}, last hash {result.LastHash}"
                : $"NOT intact: {result.Problems.Count} problem(s) in {result.Records} records");
            foreach (var problem in result.Problems)
            {
                Console.WriteLine($"  {problem.Kind} at {problem.File}:{problem.LineNumber}{(problem.Seq is { } s ? $" (seq {s})" : string.Empty)}: {problem.Detail}");
            }
            return result.Intact ? 0 : 3;
        });
        return command;
    }
}
