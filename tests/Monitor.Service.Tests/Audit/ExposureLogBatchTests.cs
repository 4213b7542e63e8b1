using Monitor.Service.Audit;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

/// <summary>A change's records appended together with one fsync; a failed batch continues where it stopped.</summary>
public class ExposureLogBatchTests
{
    private static ExposureLogBatch Batch(int count)
    {
        var batch = new ExposureLogBatch();
        for (var i = 1; i <= count; i++)
        {
            batch.Add(ExposureLogKinds.StatusChange, Day1Morning, Cause(i), new Dictionary<string, object?> { ["n"] = i });
        }
        return batch;
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_batch_is_written_in_order_and_chained(bool flushToDisk)
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var options = Options(folder.Path);
        options.FlushToDisk = flushToDisk;
        using (var writer = new ExposureLogWriter(TestKey.Value, options, clock))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(0), Figures(0));
            var batch = Batch(5);
            writer.Append(batch);
            Assert.True(batch.IsComplete);
            Assert.Equal(6, writer.LastSeq);
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(7), Figures(7)); // single appends fsync again
        }

        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(7, result.Records);
    }

    [Fact]
    public void A_batch_that_fails_midway_keeps_its_progress_and_the_retry_writes_each_record_once()
    {
        using var folder = new TempFolder();
        var clock = Clock();
        var writes = 0;
        var failAt = 3; // the third line of the batch hits a full disk, half written
        var path = ExposureLogFiles.PathOf(folder.Path, DateOnly.FromDateTime(Day1Morning.UtcDateTime));
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), clock, s => new FaultyStream(s, () => ++writes == failAt)))
        {
            var batch = Batch(5);
            Assert.Throws<ExposureLogWriteException>(() => writer.Append(batch));
            Assert.Equal(2, batch.Written);
            Assert.Equal(2, writer.LastSeq);

            writer.Append(batch);

            Assert.True(batch.IsComplete);
            Assert.Equal(5, writer.LastSeq);
        }

        var lines = Lines(path);
        Assert.Equal(5, lines.Length);
        Assert.All(Enumerable.Range(1, 5), i => Assert.Single(lines, l => l.Contains($"\"msg-{i}\"", StringComparison.Ordinal)));
        var result = ExposureLogVerifier.VerifyFile(TestKey.Value, path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
    }

    [Fact]
    public void A_payload_that_cannot_be_json_is_refused_when_added_before_anything_is_written()
    {
        var batch = new ExposureLogBatch();
        var ex = Assert.Throws<ArgumentException>(() => batch.Add(ExposureLogKinds.StatusChange, Day1Morning, Cause(1), new Dictionary<string, object?> { ["exposure"] = double.NaN }));
        Assert.Contains("status-change", ex.Message, StringComparison.Ordinal);
        Assert.Equal(0, batch.Count);
    }
}
