using MassTransit.Testing;
using Microsoft.Extensions.DependencyInjection;
using Monitor.Contracts.V1;
using Monitor.Service.Audit;
using Monitor.Service.Pipeline;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>Checkpoints of the running service: written outside the log folder, published on the bus, one at the stop.</summary>
public sealed class CheckpointTests
{
    [Fact]
    public async Task A_day_close_checkpoint_is_written_and_published_and_the_stop_anchors_the_whole_log()
    {
        using var root = new TempFolder();
        string logFolder;
        string checkpoints;
        await using (var service = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            logFolder = service.LogFolder;
            await service.TradeAsync(ServiceUnderTest.Trade("K-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000));
            var checkpointer = service.Services.GetRequiredService<ExposureLogCheckpointer>();
            checkpoints = checkpointer.Folder;
            Assert.Equal(Path.Combine(root.Path, "exposure-log-checkpoints"), checkpoints);

            var checkpoint = await checkpointer.WriteCheckpointAsync(ExposureLogCheckpointer.DayClose, CancellationToken.None);
            await service.Pipeline.WhenPublishedAsync();

            Assert.NotNull(checkpoint);
            var published = Assert.Single(service.Harness.Published.Select<ExposureLogCheckpointed>()).Context.Message;
            Assert.Equal((checkpoint.Seq, checkpoint.Mac, "day-close"), (published.Seq, published.Mac, published.Reason));
            Assert.Equal(checkpoint.MacUnder(TestKey.Value), published.CheckpointMac);
            // Nothing new since: an interval checkpoint is skipped.
            Assert.Null(await checkpointer.WriteCheckpointAsync(ExposureLogCheckpointer.Interval, CancellationToken.None));
        }

        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, logFolder, checkpointFolder: checkpoints);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        // The stop cuts one more checkpoint. (The Generic Host stops CheckpointWorker after SnapshotWorker's stop records;
        // the test harness stops hosted services in its own order, so here records may follow it, reported as unanchored.)
        Assert.True(result.AnchoredSeq > 0);
        Assert.Equal(result.LastSeq - result.AnchoredSeq, result.Unanchored);
        Assert.Contains(File.ReadLines(Directory.GetFiles(checkpoints).Single()), l => l.Contains("\"reason\":\"stop\"", StringComparison.Ordinal));
    }
}
