using Microsoft.Extensions.Diagnostics.HealthChecks;
using Monitor.Service.Audit;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

/// <summary>
/// Writes that fail. Tests run as root in CI, where chmod does not stop a write, so the obstacles are
/// ones root cannot pass: a directory where the day file should be, a folder path under a regular
/// file, a day file linked to /dev/full (ENOSPC, as on a full disk), and a stream that fails mid-line.
/// </summary>
public class ExposureLogFailureTests
{
    private static readonly DateOnly Day1 = new(2026, 12, 1);
    private static readonly DateOnly Day2 = new(2026, 12, 2);

    [Fact]
    public async Task A_directory_in_place_of_the_day_file_fails_the_write_without_advancing_and_the_retry_continues_the_chain()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        var first = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
        clock.Advance(TimeSpan.FromDays(1));
        var day2 = ExposureLogFiles.PathOf(folder.Path, Day2);
        Directory.CreateDirectory(day2);

        var ex = Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2)));

        Assert.Equal(day2, ex.Path);
        Assert.Contains(day2, ex.Message, StringComparison.Ordinal);
        Assert.False(writer.IsHealthy);
        Assert.Same(ex, writer.LastError);
        Assert.Equal((1L, first.Mac), (writer.LastSeq, writer.LastMac));
        Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2)));

        var health = new ExposureLogHealthCheck(writer);
        var unhealthy = await health.CheckHealthAsync(new HealthCheckContext());
        Assert.Equal(HealthStatus.Unhealthy, unhealthy.Status);
        Assert.Contains(day2, unhealthy.Description, StringComparison.Ordinal);

        Directory.Delete(day2);
        var second = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));

        Assert.True(writer.IsHealthy);
        Assert.Equal(HealthStatus.Healthy, (await health.CheckHealthAsync(new HealthCheckContext())).Status);
        Assert.Equal((2L, first.Mac), (second.Seq, second.PrevMac));
        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(2, result.Records);
    }

    [Fact]
    public void A_folder_under_a_regular_file_fails_the_write_and_writing_starts_once_the_folder_can_be_made()
    {
        using var temp = new TempFolder();
        var blocker = temp.Combine("not-a-folder");
        File.WriteAllText(blocker, "a file where a folder should be");
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(Path.Combine(blocker, "audit")), clock);

        var ex = Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1)));
        Assert.StartsWith(blocker, ex.Path, StringComparison.Ordinal);
        Assert.Equal(0, writer.LastSeq);

        File.Delete(blocker);
        var record = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));

        Assert.Equal((1L, new string('0', 64)), (record.Seq, record.PrevMac));
        Assert.True(ExposureLogVerifier.VerifyFolder(TestKey.Value, Path.Combine(blocker, "audit")).Intact);
    }

    [Fact]
    public void A_full_disk_fails_the_write_and_the_log_resumes_when_space_is_back()
    {
        // /dev/full answers every write with ENOSPC ("No space left on device"), for root too (Linux only).
        if (!File.Exists("/dev/full"))
        {
            return;
        }

        using var folder = new TempFolder();
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        var first = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
        clock.Advance(TimeSpan.FromDays(1));
        var day2 = ExposureLogFiles.PathOf(folder.Path, Day2);
        File.CreateSymbolicLink(day2, "/dev/full");

        var ex = Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2)));
        Assert.Equal(day2, ex.Path);
        Assert.Contains("No space left on device", ex.Reason, StringComparison.Ordinal);
        Assert.False(writer.IsHealthy);
        Assert.Equal(1, writer.LastSeq);

        File.Delete(day2);
        var second = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));

        Assert.Equal((2L, first.Mac), (second.Seq, second.PrevMac));
        Assert.True(ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path).Intact);
    }

    [Fact]
    public void A_write_that_fails_mid_line_leaves_no_torn_line_and_the_retry_continues_the_chain()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var fail = false;
        var path = ExposureLogFiles.PathOf(folder.Path, Day1);
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock, s => new FaultyStream(s, () => fail)))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
            var second = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));
            var goodLength = new FileInfo(path).Length;

            fail = true;
            var ex = Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(3), Figures(3)));
            Assert.Contains("No space left on device", ex.Reason, StringComparison.Ordinal);
            Assert.True(new FileInfo(path).Length > goodLength, "the simulated failure should have left half a line in the file");
            Assert.Equal(2, writer.LastSeq);

            fail = false;
            var third = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(3), Figures(3));
            Assert.Equal((3L, second.Mac), (third.Seq, third.PrevMac));
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(4), Figures(4));
        }

        Assert.Equal(4, Lines(path).Length);
        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
    }

    [Fact]
    public void A_torn_write_at_the_end_of_a_day_is_cut_off_before_the_next_day_file_is_started()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var fail = false;
        var day1 = ExposureLogFiles.PathOf(folder.Path, Day1);
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock, s => new FaultyStream(s, () => fail)))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
            fail = true;
            Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.DayClosed, clock.GetUtcNow(), Cause(2), Figures(2)));
            fail = false;
            clock.Advance(TimeSpan.FromDays(1));
            var next = writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));
            Assert.Equal(2, next.Seq);
        }

        Assert.Single(Lines(day1));
        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(2, result.Records);
    }
}
