using System.Text.Json;
using Monitor.Cli.Tests.Support;
using Monitor.Service.Audit;

namespace Monitor.Cli.Tests.Verbs;

/// <summary><c>monitor verify-log</c> with the record key and the checkpoints: exit codes and the JSON shape (src/Monitor.Cli/README.md).</summary>
public sealed class VerifyLogVerbTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("monitor-verify-log-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string Log => Path.Combine(_dir, "exposure-log");

    private string Checkpoints => Path.Combine(_dir, "checkpoints");

    private void WriteLog(int records, int checkpointAt)
    {
        var clock = new FixedClock();
        using var writer = new ExposureLogWriter(TestKey.Value, new ExposureLogOptions { Folder = Log, FlushToDisk = false }, clock);
        for (var i = 1; i <= records; i++)
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), new ExposureLogCause($"m-{i}", "timer"), JsonSerializer.SerializeToElement(new { book = "B", i }));
            if (i == checkpointAt)
            {
                var (day, seq, mac, dayRecords) = writer.Anchor()!.Value;
                ExposureLogCheckpointFiles.Append(Checkpoints, TestKey.Value, new ExposureLogCheckpoint(day, seq, mac, dayRecords, clock.GetUtcNow(), "interval"));
            }
        }
    }

    [Fact]
    public void An_intact_log_reports_what_the_checkpoints_anchor_and_what_is_unanchored()
    {
        WriteLog(12, 10);
        var keyFile = TestKey.FileIn(_dir);

        var (exit, output, _) = CliRun.Invoke("verify-log", Log, "--key-file", keyFile, "--checkpoints", Checkpoints);

        Assert.Equal(0, exit);
        Assert.Contains("intact: 12 records", output, StringComparison.Ordinal);
        Assert.Contains("up to seq 10; 2 record(s) after it are unanchored", output, StringComparison.Ordinal);
    }

    [Fact]
    public void A_cut_tail_is_a_broken_log_exit_3_and_json_names_the_problem()
    {
        WriteLog(12, 10);
        var file = Directory.GetFiles(Log).Single();
        File.WriteAllLines(file, File.ReadAllLines(file)[..8]);

        var (exit, output, _) = CliRun.Invoke("verify-log", Log, "--key-file", TestKey.FileIn(_dir), "--checkpoints", Checkpoints, "--json");

        Assert.Equal(3, exit);
        using var json = JsonDocument.Parse(output);
        Assert.False(json.RootElement.GetProperty("intact").GetBoolean());
        var problem = Assert.Single(json.RootElement.GetProperty("problems").EnumerateArray());
        Assert.Equal("TailCut", problem.GetProperty("kind").GetString());
        Assert.Equal(10, problem.GetProperty("seq").GetInt64());
    }

    [Fact]
    public void Without_a_key_it_refuses_with_exit_1_and_names_both_ways_to_give_one()
    {
        WriteLog(2, 0);

        var (exit, _, error) = CliRun.Invoke("verify-log", Log, "--key-file", Path.Combine(_dir, "absent.key"));

        Assert.Equal(1, exit);
        Assert.Contains("absent.key", error, StringComparison.Ordinal);
    }
}

/// <summary>A clock standing at 2026-12-01 09:00 UTC.</summary>
internal sealed class FixedClock : TimeProvider
{
    public override DateTimeOffset GetUtcNow() => new(2026, 12, 1, 9, 0, 0, TimeSpan.Zero);
}
