using System.Security.Cryptography;
using System.Text;
using Monitor.Service.Audit;
using Monitor.Service.Storage;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

/// <summary>
/// Issue 10, "A record only its keeper can write": each finding, tried as an attacker who can write the log folder,
/// is caught by the verifier with the key (and, where the chain alone cannot show it, with the checkpoints).
/// On the unkeyed SHA-256 chain each of these verified intact.
/// </summary>
public sealed class RecordForgeryTests : IDisposable
{
    private static readonly DateOnly Day1 = new(2026, 12, 1);
    private static readonly DateOnly Day2 = new(2026, 12, 2);
    private readonly TempFolder _root = new();

    public void Dispose() => _root.Dispose();

    private string LogFolder => Path.Combine(_root.Path, "exposure-log");

    private string Checkpoints => Path.Combine(_root.Path, "exposure-log-checkpoints");

    /// <summary>Day 1: 30 records, a checkpoint after each 10 (the last one the day's close); day 2: 30 records, a checkpoint after 25.</summary>
    private void WriteAnchoredLog()
    {
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(LogFolder), clock);
        for (var i = 1; i <= 60; i++)
        {
            if (i == 31)
            {
                clock.Advance(TimeSpan.FromDays(1));
            }
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(i), Figures(i));
            clock.Advance(TimeSpan.FromMinutes(1));
            if (i is 10 or 20 or 30 or 55)
            {
                var (day, seq, mac, dayRecords) = writer.Anchor()!.Value;
                ExposureLogCheckpointFiles.Append(Checkpoints, TestKey.Value, new ExposureLogCheckpoint(day, seq, mac, dayRecords, clock.GetUtcNow(), i == 30 ? "day-close" : "interval"));
            }
        }
    }

    private ExposureLogVerification Verify(RecordKey? key = null) =>
        ExposureLogVerifier.VerifyFolder(key ?? TestKey.Value, LogFolder, checkpointFolder: Checkpoints);

    [Fact]
    public void The_untouched_log_is_intact_up_to_the_last_checkpoint_and_the_rest_is_unanchored()
    {
        WriteAnchoredLog();

        var result = Verify();

        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal((4, 55L, 5L), (result.Checkpoints, result.AnchoredSeq!.Value, result.Unanchored));
    }

    [Fact]
    public void A_record_appended_with_a_recomputed_plain_sha256_is_a_mac_mismatch()
    {
        WriteAnchoredLog();
        var path = ExposureLogFiles.PathOf(LogFolder, Day2);
        var last = Lines(path)[^1];
        var prev = last[(last.LastIndexOf(",\"mac\":\"", StringComparison.Ordinal) + 8)..^2];
        // The forger's record: the next seq, prevMac = the last mac, and the "mac" recomputed the old way (SHA-256 of the canonical bytes).
        var canonical = "{\"format\":\"exposure-log/2\",\"seq\":61,\"kind\":\"status-change\",\"eventTime\":\"2026-12-02T09:40:00.0000000Z\","
            + "\"writtenTime\":\"2026-12-02T09:40:00.0000000Z\",\"cause\":{\"id\":null,\"type\":\"timer\"},"
            + "\"payload\":{\"limitId\":\"rates-1-dv01\",\"status\":\"within\",\"previous\":\"breach\"},\"prevMac\":\"" + prev + "\"}";
        var forged = canonical[..^1] + ",\"mac\":\"" + Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(canonical))) + "\"}";
        File.AppendAllText(path, forged + "\n");

        var result = Verify();

        Assert.False(result.Intact);
        var problem = Assert.Single(result.Problems);
        Assert.Equal((ExposureLogProblemKind.MacMismatch, 61L), (problem.Kind, problem.Seq!.Value));
    }

    [Fact]
    public void A_tail_cut_behind_a_checkpoint_is_caught()
    {
        WriteAnchoredLog();
        var path = ExposureLogFiles.PathOf(LogFolder, Day2);
        WriteLines(path, Lines(path)[..^20]); // the last 20 records: seq 41..60, across the checkpoint at 55

        var result = Verify();

        Assert.False(result.Intact);
        var problem = Assert.Single(result.Problems);
        Assert.Equal((ExposureLogProblemKind.TailCut, 55L), (problem.Kind, problem.Seq!.Value));
        Assert.Contains("log ends at seq 40", problem.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void The_newest_day_file_deleted_is_caught()
    {
        WriteAnchoredLog();
        File.Delete(ExposureLogFiles.PathOf(LogFolder, Day2));

        var result = Verify();

        Assert.False(result.Intact);
        var problem = Assert.Single(result.Problems);
        Assert.Equal(ExposureLogProblemKind.DayFileMissing, problem.Kind);
        Assert.Contains("exposures-2026-12-02.jsonl", problem.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void A_rewrite_from_a_point_with_the_chain_recomputed_is_caught_without_the_key_and_with_a_stolen_one()
    {
        WriteAnchoredLog();
        var (path1, path2) = (ExposureLogFiles.PathOf(LogFolder, Day1), ExposureLogFiles.PathOf(LogFolder, Day2));
        var lines = Lines(path1).Concat(Lines(path2)).ToArray();
        void WriteBoth(string[] rewritten)
        {
            WriteLines(path1, rewritten[..30]);
            WriteLines(path2, rewritten[30..]);
        }

        // From record 15 on, "a breach changed to within": the forger changes a figure and recomputes the chain to the end.
        WriteBoth(Rewrite(lines, 14, canonical => Convert.ToHexStringLower(SHA256.HashData(canonical))));
        var withoutKey = Verify();
        Assert.Contains(withoutKey.Problems, p => p.Kind == ExposureLogProblemKind.MacMismatch && p.Seq == 15);

        WriteBoth(Rewrite(lines, 14, canonical => TestKey.Value.Mac(canonical)));
        var withStolenKey = Verify();

        // Every MAC holds and every link too, but the checkpoints at seq 20, 30 and 55 (cut before the rewrite) disagree.
        Assert.False(withStolenKey.Intact);
        Assert.DoesNotContain(withStolenKey.Problems, p => p.Kind is ExposureLogProblemKind.MacMismatch or ExposureLogProblemKind.BrokenLink);
        Assert.Equal([20L, 30L, 55L], withStolenKey.Problems.Where(p => p.Kind == ExposureLogProblemKind.CheckpointMismatch).Select(p => p.Seq!.Value));
    }

    [Fact]
    public void A_forged_checkpoint_is_refused_and_anchors_nothing()
    {
        WriteAnchoredLog();
        var file = Directory.GetFiles(Checkpoints, "checkpoints-2026-12-02.jsonl").Single();
        var line = File.ReadAllLines(file).Single();
        File.WriteAllText(file, line.Replace("\"seq\":55", "\"seq\":60", StringComparison.Ordinal) + "\n");

        var result = Verify();

        Assert.Contains(result.Problems, p => p.Kind == ExposureLogProblemKind.CheckpointUnverifiable);
        Assert.Equal(30L, result.AnchoredSeq);
    }

    [Fact]
    public void Another_key_fails_every_record()
    {
        WriteAnchoredLog();

        var result = ExposureLogVerifier.VerifyFolder(RecordKey.FromText(new string('k', 40), "another key"), LogFolder);

        Assert.Equal(60, result.Problems.Count(p => p.Kind == ExposureLogProblemKind.MacMismatch));
    }

    /// <summary>Lines from index <paramref name="from"/> on get a changed figure and a chain recomputed with <paramref name="mac"/>.</summary>
    private static string[] Rewrite(string[] lines, int from, Func<byte[], string> mac)
    {
        var result = lines.ToArray();
        string? previous = null;
        for (var i = from; i < result.Length; i++)
        {
            var line = result[i];
            var cut = line.LastIndexOf(",\"mac\":\"", StringComparison.Ordinal);
            var body = line[..cut];
            if (i == from)
            {
                body = body.Replace("\"status\":\"normal\"", "\"status\":\"within\"", StringComparison.Ordinal);
            }
            if (previous is not null)
            {
                var at = body.LastIndexOf(",\"prevMac\":\"", StringComparison.Ordinal);
                body = body[..at] + ",\"prevMac\":\"" + previous + "\"";
            }
            var canonical = Encoding.UTF8.GetBytes(body + "}");
            previous = mac(canonical);
            result[i] = body + ",\"mac\":\"" + previous + "\"}";
        }
        return result;
    }
}
