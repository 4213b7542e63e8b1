using System.Text;
using Monitor.Service.Audit;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

public class ExposureLogVerifierTests
{
    private static readonly DateOnly Day1 = new(2026, 12, 1);
    private static readonly DateOnly Day2 = new(2026, 12, 2);

    /// <summary>Writes 6 records on day 1 (and 3 on day 2 when asked) and returns the day files.</summary>
    private static (string Day1File, string Day2File) WriteLog(TempFolder folder, bool secondDay = false)
    {
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        for (var i = 1; i <= 6; i++)
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(i), Figures(i));
            clock.Advance(TimeSpan.FromMinutes(10));
        }

        if (secondDay)
        {
            clock.Advance(TimeSpan.FromDays(1));
            for (var i = 7; i <= 9; i++)
            {
                writer.Append(ExposureLogKinds.StatusChange, clock.GetUtcNow(), Cause(i), Figures(i));
            }
        }

        return (ExposureLogFiles.PathOf(folder.Path, Day1), ExposureLogFiles.PathOf(folder.Path, Day2));
    }

    [Fact]
    public void A_changed_figure_is_a_hash_mismatch_at_that_line_only()
    {
        using var folder = new TempFolder();
        var (path, _) = WriteLog(folder);
        var lines = Lines(path);
        Assert.Contains("\"dv01\":-1253.5", lines[2], StringComparison.Ordinal); // record 3: dv01 = -1250.5 - 3
        lines[2] = lines[2].Replace("\"dv01\":-1253.5", "\"dv01\":-253.5", StringComparison.Ordinal);
        WriteLines(path, lines);

        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);

        Assert.False(result.Intact);
        var problem = Assert.Single(result.Problems);
        Assert.Equal((3, 3L, ExposureLogProblemKind.MacMismatch), (problem.LineNumber, problem.Seq!.Value, problem.Kind));
        Assert.Equal("exposures-2026-12-01.jsonl", problem.File);
    }

    [Fact]
    public void A_changed_figure_with_its_mac_recomputed_under_a_stolen_key_breaks_the_link_of_the_next_line()
    {
        using var folder = new TempFolder();
        var (path, _) = WriteLog(folder);
        var lines = Lines(path);
        lines[2] = Remac(lines[2].Replace("\"dv01\":-1253.5", "\"dv01\":-253.5", StringComparison.Ordinal));
        WriteLines(path, lines);

        var problem = Assert.Single(ExposureLogVerifier.VerifyFile(TestKey.Value, path).Problems);

        Assert.Equal((4, ExposureLogProblemKind.BrokenLink), (problem.LineNumber, problem.Kind));
    }

    [Fact]
    public void A_deleted_line_is_a_gap_and_a_broken_link_at_the_line_after_it()
    {
        using var folder = new TempFolder();
        var (path, _) = WriteLog(folder);
        WriteLines(path, Lines(path).Where((_, i) => i != 2));

        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);

        Assert.Equal(5, result.Records);
        Assert.All(result.Problems, p => Assert.Equal((3, 4L), (p.LineNumber, p.Seq!.Value)));
        Assert.Equal(
            [ExposureLogProblemKind.SequenceGap, ExposureLogProblemKind.BrokenLink],
            result.Problems.Select(p => p.Kind));
    }

    [Fact]
    public void Swapped_lines_are_detected()
    {
        using var folder = new TempFolder();
        var (path, _) = WriteLog(folder);
        var lines = Lines(path);
        (lines[2], lines[3]) = (lines[3], lines[2]);
        WriteLines(path, lines);

        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);

        Assert.False(result.Intact);
        Assert.Contains(result.Problems, p => p.LineNumber == 3 && p.Kind == ExposureLogProblemKind.BrokenLink);
        Assert.Contains(result.Problems, p => p.LineNumber == 4 && p.Kind == ExposureLogProblemKind.SequenceGap);
        Assert.DoesNotContain(result.Problems, p => p.Kind == ExposureLogProblemKind.MacMismatch);
    }

    [Fact]
    public void Deleting_the_first_line_of_the_log_is_detected_against_the_start_of_the_chain()
    {
        using var folder = new TempFolder();
        var (path, _) = WriteLog(folder);
        WriteLines(path, Lines(path).Skip(1));

        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);

        Assert.Contains(result.Problems, p => p.LineNumber == 1 && p.Kind == ExposureLogProblemKind.SequenceGap);
        Assert.Contains(result.Problems, p => p.LineNumber == 1 && p.Kind == ExposureLogProblemKind.BrokenLink);
    }

    [Fact]
    public void Deleting_the_first_line_of_a_day_breaks_the_link_to_the_previous_day_file()
    {
        using var folder = new TempFolder();
        var (_, day2) = WriteLog(folder, secondDay: true);
        Assert.True(ExposureLogVerifier.VerifyDay(TestKey.Value, folder.Path, Day2).Intact);
        WriteLines(day2, Lines(day2).Skip(1));

        var result = ExposureLogVerifier.VerifyDay(TestKey.Value, folder.Path, Day2);

        Assert.Contains(result.Problems, p => p.LineNumber == 1 && p.Seq == 8 && p.Kind == ExposureLogProblemKind.SequenceGap);
        Assert.Contains(result.Problems, p => p.LineNumber == 1 && p.Kind == ExposureLogProblemKind.BrokenLink && p.Detail.Contains("exposures-2026-12-01.jsonl", StringComparison.Ordinal));
    }

    [Fact]
    public void A_range_of_days_is_verified_as_one_chain()
    {
        using var folder = new TempFolder();
        WriteLog(folder, secondDay: true);

        var onlyDay2 = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path, from: Day2, to: Day2);
        var both = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path, from: Day1, to: Day2);

        Assert.True(onlyDay2.Intact, string.Join("; ", onlyDay2.Problems));
        Assert.Equal((3, 7L, 9L), (onlyDay2.Records, onlyDay2.FirstSeq!.Value, onlyDay2.LastSeq!.Value));
        Assert.True(both.Intact, string.Join("; ", both.Problems));
        Assert.Equal(["exposures-2026-12-01.jsonl", "exposures-2026-12-02.jsonl"], both.Files);
    }

    [Fact]
    public void A_torn_last_line_and_a_garbage_line_are_reported()
    {
        using var folder = new TempFolder();
        var (path, _) = WriteLog(folder);
        var lines = Lines(path).ToList();
        lines.Insert(1, "this is not a record");
        File.WriteAllText(path, string.Concat(lines.Select(l => l + "\n")) + "{\"v\":1,\"seq\":7,\"ki");

        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);

        Assert.Contains(result.Problems, p => p.LineNumber == 2 && p.Kind == ExposureLogProblemKind.Unparsable);
        Assert.Contains(result.Problems, p => p.LineNumber == 8 && p.Kind == ExposureLogProblemKind.TornLine);
        Assert.DoesNotContain(result.Problems, p => p.Kind is ExposureLogProblemKind.BrokenLink or ExposureLogProblemKind.MacMismatch);
    }

    [Fact]
    public void A_missing_day_is_reported()
    {
        using var folder = new TempFolder();
        var result = ExposureLogVerifier.VerifyDay(TestKey.Value, folder.Path, Day1);
        Assert.False(result.Intact);
        Assert.Equal(ExposureLogProblemKind.MissingFile, Assert.Single(result.Problems).Kind);
    }

    [Fact]
    public void A_missing_folder_is_reported()
    {
        using var folder = new TempFolder();
        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Combine("nowhere"));
        Assert.False(result.Intact);
        Assert.Equal(ExposureLogProblemKind.MissingFile, Assert.Single(result.Problems).Kind);
    }

    [Fact]
    public void The_day_file_the_writer_has_open_can_be_verified()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
        writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));

        var result = ExposureLogVerifier.VerifyDay(TestKey.Value, folder.Path, Day1);

        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(2, result.Records);
    }

    /// <summary>What a forger with the key would do: recompute the mac of a changed line (HMAC-SHA256 of the line without its mac member).</summary>
    private static string Remac(string line)
    {
        var cut = line.LastIndexOf(",\"mac\":\"", StringComparison.Ordinal);
        var canonical = line[..cut] + "}";
        return line[..cut] + ",\"mac\":\"" + TestKey.Value.Mac(Encoding.UTF8.GetBytes(canonical)) + "\"}";
    }
}
