using System.Text.Json;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

public class ExposureLogWriterTests
{
    private static readonly DateOnly Day1 = new(2026, 12, 1);
    private static readonly DateOnly Day2 = new(2026, 12, 2);

    [Fact]
    public void Records_over_two_days_go_to_two_files_chained_across_the_day_boundary_and_verify()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var records = new List<ExposureLogRecord>();
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            for (var i = 1; i <= 10; i++)
            {
                records.Add(writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(i), Figures(i)));
                clock.Advance(TimeSpan.FromHours(3)); // 09:00 + 5 x 3h = next day 00:00 from the 6th record on
            }
        }

        Assert.Equal(Enumerable.Range(1, 10).Select(i => (long)i), records.Select(r => r.Seq));
        Assert.Equal(new string('0', 64), records[0].PrevMac);
        for (var i = 1; i < records.Count; i++)
        {
            Assert.Equal(records[i - 1].Mac, records[i].PrevMac);
        }

        var day1Lines = Lines(folder.Combine("exposures-2026-12-01.jsonl"));
        var day2Lines = Lines(folder.Combine("exposures-2026-12-02.jsonl"));
        Assert.Equal(records.Take(5).Select(r => r.Line), day1Lines);
        Assert.Equal(records.Skip(5).Select(r => r.Line), day2Lines);

        var all = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(all.Intact, string.Join("; ", all.Problems));
        Assert.Equal(10, all.Records);
        Assert.Equal(1, all.FirstSeq);
        Assert.Equal(10, all.LastSeq);
        Assert.Equal(records[^1].Mac, all.LastMac);

        var second = ExposureLogVerifier.VerifyDay(TestKey.Value, folder.Path, Day2);
        Assert.True(second.Intact, string.Join("; ", second.Problems));
        Assert.Equal(6, second.FirstSeq);
    }

    [Fact]
    public void The_day_file_is_named_by_the_business_date_of_the_written_time()
    {
        using var folder = new TempFolder();
        var clock = new ManualClock(new DateTimeOffset(2026, 12, 2, 3, 0, 0, TimeSpan.Zero));
        var options = Options(folder.Path);
        // 03:00 UTC = 22:00 the day before in New York (EST, UTC-5), before a 23:00 roll.
        var roll = new BusinessDayRoll(new TimeOnly(23, 0), TimeZoneInfo.FindSystemTimeZoneById("America/New_York"));
        using (var writer = new ExposureLogWriter(TestKey.Value, options, clock, roll))
        {
            writer.Append(ExposureLogKinds.DayClosed, clock.Now, Cause(1), Figures(1));
        }

        Assert.True(File.Exists(ExposureLogFiles.PathOf(folder.Path, Day1)));
        Assert.False(File.Exists(ExposureLogFiles.PathOf(folder.Path, Day2)));
    }

    [Fact]
    public void A_clock_that_steps_back_keeps_writing_to_the_newest_day_file()
    {
        using var folder = new TempFolder();
        var clock = new ManualClock(new DateTimeOffset(2026, 12, 2, 0, 0, 1, TimeSpan.Zero));
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.Now, Cause(1), Figures(1));
            clock.Now = clock.Now.AddSeconds(-2);
            writer.Append(ExposureLogKinds.Snapshot, clock.Now, Cause(2), Figures(2));
        }

        Assert.False(File.Exists(ExposureLogFiles.PathOf(folder.Path, Day1)));
        Assert.Equal(2, Lines(ExposureLogFiles.PathOf(folder.Path, Day2)).Length);
        Assert.True(ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path).Intact);
    }

    [Fact]
    public void A_new_writer_on_the_same_folder_continues_seq_and_chain()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        ExposureLogRecord last;
        using (var first = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            first.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
            last = first.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));
        }

        clock.Advance(TimeSpan.FromMinutes(5));
        using (var second = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            Assert.Equal(2, second.LastSeq);
            Assert.Equal(last.Mac, second.LastMac);
            var next = second.Append(ExposureLogKinds.TradeApplied, clock.GetUtcNow(), Cause(3), Figures(3));
            Assert.Equal(3, next.Seq);
            Assert.Equal(last.Mac, next.PrevMac);
        }

        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(3, result.Records);
    }

    [Fact]
    public void A_restart_on_a_later_day_starts_a_new_file_linked_to_the_last_record_of_the_older_one()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        ExposureLogRecord last;
        using (var first = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            last = first.Append(ExposureLogKinds.DayClosed, clock.GetUtcNow(), Cause(1), Figures(1));
        }

        clock.Advance(TimeSpan.FromDays(3)); // a weekend in between: the previous file is not yesterday's
        using (var second = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            var next = second.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));
            Assert.Equal(2, next.Seq);
            Assert.Equal(last.Mac, next.PrevMac);
        }

        var day4 = ExposureLogVerifier.VerifyDay(TestKey.Value, folder.Path, new DateOnly(2026, 12, 4));
        Assert.True(day4.Intact, string.Join("; ", day4.Problems));
    }

    [Fact]
    public void Concurrent_appends_from_several_threads_keep_seq_and_chain_consistent()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        const int threads = 4;
        const int perThread = 50;
        var seqs = new System.Collections.Concurrent.ConcurrentBag<long>();
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock))
        {
            Parallel.For(0, threads, new ParallelOptions { MaxDegreeOfParallelism = threads }, t =>
            {
                for (var i = 0; i < perThread; i++)
                {
                    seqs.Add(writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause((t * perThread) + i), Figures(i)).Seq);
                }
            });
        }

        Assert.Equal(Enumerable.Range(1, threads * perThread).Select(i => (long)i), seqs.Order());
        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(threads * perThread, result.Records);
    }

    [Fact]
    public void Dictionary_payloads_are_written_as_json_objects()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        var record = writer.Append(
            ExposureLogKinds.LimitsReloaded, clock.GetUtcNow(), new ExposureLogCause(null, "file-watch"),
            new Dictionary<string, object?> { ["file"] = "limits.json", ["limits"] = 12, ["warning"] = 0.8 });

        Assert.Contains("\"payload\":{\"file\":\"limits.json\",\"limits\":12,\"warning\":0.8}", record.Line, StringComparison.Ordinal);
    }

    [Fact]
    public void Bad_input_is_rejected_with_the_field_named_and_nothing_written()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        using var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock);
        var now = clock.GetUtcNow();

        Assert.Contains("kind", Assert.Throws<ArgumentException>(() => writer.Append("Snapshot", now, Cause(1), Figures(1))).Message, StringComparison.Ordinal);
        Assert.Contains("payload", Assert.Throws<ArgumentException>(() => writer.Append("snapshot", now, Cause(1), JsonSerializer.SerializeToElement(new[] { 1, 2 }))).Message, StringComparison.Ordinal);
        Assert.Contains("payload", Assert.Throws<ArgumentException>(() => writer.Append("snapshot", now, Cause(1), new Dictionary<string, object?> { ["dv01"] = double.NaN })).Message, StringComparison.Ordinal);
        Assert.Contains("MessageType", Assert.Throws<ArgumentException>(() => writer.Append("snapshot", now, new ExposureLogCause("x", " "), Figures(1))).Message, StringComparison.Ordinal);

        Assert.Equal(0, writer.LastSeq);
        Assert.True(writer.IsHealthy);
        Assert.Empty(Directory.GetFiles(folder.Path));
    }

    [Fact]
    public void Bad_options_stop_the_start_with_the_key_named()
    {
        var ex = Assert.Throws<ArgumentException>(() => new ExposureLogWriter(TestKey.Value, new ExposureLogOptions { Folder = " " }, TimeProvider.System));
        Assert.Contains("ExposureLog:Folder", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Flushing_to_disk_writes_the_same_records()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var options = Options(folder.Path);
        options.FlushToDisk = true;
        using (var writer = new ExposureLogWriter(TestKey.Value, options, clock))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(1), Figures(1));
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(2), Figures(2));
        }

        Assert.True(ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path).Intact);
        Assert.Equal(2, Lines(ExposureLogFiles.PathOf(folder.Path, Day1)).Length);
    }
}
