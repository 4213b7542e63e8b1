using System.CommandLine;
using System.Globalization;
using Monitor.Cli.Output;
using Monitor.Service.Audit;
using Monitor.Service.Storage;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor verify-log FOLDER [--day YYYY-MM-DD] [--key-file FILE] [--checkpoints DIR] [--json]</c>: checks the
/// exposure log's MAC chain under the record key and, given the checkpoint folder, that nothing up to the newest
/// checkpoint was cut, replaced or added. Exit 0 intact, 1 bad option (no key), 3 tampered or broken.
/// </summary>
internal static class VerifyLogVerb
{
    public static Command Create()
    {
        var folder = new Argument<DirectoryInfo>("folder") { Description = "The exposure log folder (ExposureLog:Folder)." };
        var day = new Option<string?>("--day") { Description = "Verify only this business day (YYYY-MM-DD); default: every day in the folder." };
        var keyFile = new Option<FileInfo?>("--key-file") { Description = $"The record key file the log was written with (Record:KeyFile); default: the environment variable {RecordKey.Variable}." };
        var checkpoints = new Option<DirectoryInfo?>("--checkpoints") { Description = "The checkpoint folder (Record:CheckpointFolder): prove that no record up to the newest checkpoint was cut, replaced or added." };
        var json = CommonOptions.Json();
        var command = new Command("verify-log", "Verify an exposure log: recompute every MAC under the record key, check the chain, the sequence and the checkpoints.");
        command.Arguments.Add(folder);
        command.Options.Add(day);
        command.Options.Add(keyFile);
        command.Options.Add(checkpoints);
        command.Options.Add(json);
        command.SetAction(parse => Run(
            parse.GetValue(folder)!, parse.GetValue(day), parse.GetValue(keyFile), parse.GetValue(checkpoints), parse.GetValue(json),
            parse.InvocationConfiguration.Output, parse.InvocationConfiguration.Error, Environment.GetEnvironmentVariable));
        return command;
    }

    public static int Run(
        DirectoryInfo folder, string? dayText, FileInfo? keyFile, DirectoryInfo? checkpoints, bool json,
        TextWriter output, TextWriter error, Func<string, string?> environment)
    {
        var (key, problem) = RecordKey.Resolve(keyFile?.FullName, "--key-file", environment);
        if (key is null)
        {
            error.WriteLine(problem);
            return 1;
        }
        if (checkpoints is not null && !checkpoints.Exists)
        {
            error.WriteLine($"--checkpoints: '{checkpoints.FullName}' does not exist; give the checkpoint folder (Record:CheckpointFolder).");
            return 1;
        }
        ExposureLogVerification result;
        if (dayText is null)
        {
            result = ExposureLogVerifier.VerifyFolder(key, folder.FullName, checkpointFolder: checkpoints?.FullName);
        }
        else if (DateOnly.TryParseExact(dayText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d))
        {
            result = ExposureLogVerifier.VerifyFolder(key, folder.FullName, d, d, checkpoints?.FullName);
        }
        else
        {
            error.WriteLine($"--day: '{dayText}' is not a date in the form YYYY-MM-DD.");
            return 1;
        }
        if (json)
        {
            JsonOutput.Write(output, new
            {
                intact = result.Intact,
                records = result.Records,
                firstSeq = result.FirstSeq,
                lastSeq = result.LastSeq,
                lastMac = result.LastMac,
                checkpoints = checkpoints is null ? (int?)null : result.Checkpoints,
                anchoredSeq = result.AnchoredSeq,
                unanchored = result.Unanchored,
                files = result.Files,
                problems = result.Problems.Select(p => new { kind = p.Kind.ToString(), file = p.File, line = p.LineNumber, seq = p.Seq, detail = p.Detail }),
            });
        }
        else
        {
            Write(output, result, checkpoints is not null);
        }
        return result.Intact ? 0 : 3;
    }

    private static void Write(TextWriter output, ExposureLogVerification result, bool withCheckpoints)
    {
        var inv = CultureInfo.InvariantCulture;
        output.WriteLine(result.Intact
            ? string.Create(inv, $"intact: {result.Records} records, seq {result.FirstSeq}..{result.LastSeq}, every MAC holds under the key, last mac {result.LastMac}")
            : string.Create(inv, $"NOT intact: {result.Problems.Count} problem(s) in {result.Records} records"));
        if (!withCheckpoints)
        {
            output.WriteLine("unanchored: no checkpoints given (--checkpoints): a cut tail, a deleted newest day or a rewrite by a key holder cannot be shown.");
        }
        else if (result.AnchoredSeq is { } anchored)
        {
            output.WriteLine(string.Create(inv, $"anchored: {result.Checkpoints} checkpoint(s), up to seq {anchored}; {result.Unanchored} record(s) after it are unanchored (their chain holds, but no checkpoint vouches for them)."));
        }
        else
        {
            output.WriteLine(string.Create(inv, $"unanchored: {result.Checkpoints} checkpoint(s) read, none anchors a record of the log; all {result.Unanchored} record(s) are unanchored."));
        }
        foreach (var problem in result.Problems)
        {
            output.WriteLine($"  {problem.Kind} at {problem.File}:{problem.LineNumber}{(problem.Seq is { } s ? $" (seq {s})" : string.Empty)}: {problem.Detail}");
        }
    }
}
