using System.Text;
using System.Text.Json;
using Microsoft.Extensions.Time.Testing;
using Monitor.Service.Audit;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

/// <summary>Start-up after a crash: the chain continues from the last complete, valid line.</summary>
public class ExposureLogRestartTests
{
    private static readonly DateOnly Day1 = new(2026, 12, 1);

    private static string WriteThree(TempFolder folder, FakeTimeProvider clock)
    {
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        for (var i = 1; i <= 3; i++)
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(i), Figures(i));
        }

        return ExposureLogFiles.PathOf(folder.Path, Day1);
    }

    [Fact]
    public void A_torn_last_line_from_a_crash_is_cut_off_and_recorded_before_the_next_record()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var path = WriteThree(folder, clock);
        var fragment = Encoding.UTF8.GetBytes("{\"v\":1,\"seq\":4,\"kind\":\"snap");
        using (var stream = new FileStream(path, FileMode.Append))
        {
            stream.Write(fragment);
        }

        Assert.False(ExposureLogVerifier.VerifyFile(TestKey.Value, path).Intact); // torn before the restart

        ExposureLogRecord next;
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            Assert.Equal(3, writer.LastSeq);
            next = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(4), Figures(4));
        }

        var lines = Lines(path);
        Assert.Equal(5, lines.Length);
        Assert.Equal(5, next.Seq);
        using var repair = JsonDocument.Parse(lines[3]);
        Assert.Equal(ExposureLogKinds.LogRepaired, repair.RootElement.GetProperty("kind").GetString());
        var payload = repair.RootElement.GetProperty("payload");
        Assert.Equal(fragment.Length, payload.GetProperty("removedBytes").GetInt32());
        Assert.Equal(fragment, Convert.FromBase64String(payload.GetProperty("removedBase64").GetString()!));
        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
    }

    [Fact]
    public void A_changed_last_line_stops_the_start_naming_the_file()
    {
        using var folder = new TempFolder();
        var path = WriteThree(folder, Clock());
        var lines = Lines(path);
        lines[2] = lines[2].Replace("\"status\":\"normal\"", "\"status\":\"breach\"", StringComparison.Ordinal);
        WriteLines(path, lines);

        var ex = Assert.Throws<ExposureLogOpenException>(() => new ExposureLogWriter(TestKey.Value, Options(folder.Path), TimeProvider.System));

        Assert.Equal(path, ex.Path);
        Assert.Contains("seq 3", ex.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void An_unparsable_last_complete_line_stops_the_start()
    {
        using var folder = new TempFolder();
        var path = WriteThree(folder, Clock());
        File.AppendAllText(path, "not a record\n");

        var ex = Assert.Throws<ExposureLogOpenException>(() => new ExposureLogWriter(TestKey.Value, Options(folder.Path), TimeProvider.System));
        Assert.Contains("unparsable", ex.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void An_empty_newest_day_file_is_passed_over_to_find_the_end_of_the_chain()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        WriteThree(folder, clock);
        File.WriteAllBytes(ExposureLogFiles.PathOf(folder.Path, Day1.AddDays(1)), []);

        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);

        Assert.Equal(3, writer.LastSeq);
    }

    [Fact]
    public void A_torn_line_followed_by_only_an_empty_newer_file_is_still_repaired()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var path = WriteThree(folder, clock);
        File.AppendAllText(path, "{\"v\":1,\"se");
        File.WriteAllBytes(ExposureLogFiles.PathOf(folder.Path, Day1.AddDays(1)), []);

        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            Assert.Equal(5, writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(4), Figures(4)).Seq);
        }

        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
    }

    [Fact]
    public void A_torn_line_in_a_day_file_older_than_the_newest_non_empty_one_stops_the_start()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var path = WriteThree(folder, clock);
        clock.Advance(TimeSpan.FromDays(1));
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(4), Figures(4));
        }

        File.AppendAllText(path, "{\"v\":1,\"se");
        File.WriteAllText(ExposureLogFiles.PathOf(folder.Path, Day1.AddDays(1)), "{\"v\":1,"); // the newer file holds only a torn line

        var ex = Assert.Throws<ExposureLogOpenException>(() => new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock));
        Assert.Equal(path, ex.Path);
    }
}
