using System.Diagnostics;
using System.Text.Json;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Monitor.Faults.Tests.Support;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Storage;
using Xunit.Abstractions;

namespace Monitor.Faults.Tests;

/// <summary>
/// A full disk for real: the exposure log and the trade journal on a small tmpfs that the test fills until the kernel
/// answers ENOSPC. First the writers alone (a failed append leaves no partial line, does not advance the chain or the
/// sequence, and the same append succeeds once space is back), then the whole service.
/// </summary>
[Trait("Category", "Fault")]
public sealed class DiskFullTests(ITestOutputHelper output)
{
    private static readonly DateTimeOffset Start = DateTimeOffset.UtcNow;

    [Fact]
    public void Exposure_log_append_on_a_full_disk_fails_cleanly_and_the_same_append_succeeds_once_space_is_freed()
    {
        using var folder = new WorkFolder();
        using var disk = TmpfsMount.Create(folder.Combine("log"), 256 * 1024);
        var options = new ExposureLogOptions { Folder = disk.Folder, FlushToDisk = true };
        var written = 0;
        using (var writer = new ExposureLogWriter(options, TimeProvider.System))
        {
            for (var i = 0; i < 20; i++, written++)
            {
                writer.Append(ExposureLogKinds.Snapshot, Start, Cause(i), Figures(i));
            }
            var filled = disk.Fill();

            // The day file's last page may hold a few more records: append until the disk refuses one.
            ExposureLogWriteException? failure = null;
            for (var i = 0; i < 100 && failure is null; i++)
            {
                var seqBefore = writer.LastSeq;
                var hashBefore = writer.LastHash;
                try
                {
                    writer.Append(ExposureLogKinds.Snapshot, Start, Cause(written), Figures(written));
                    written++;
                }
                catch (ExposureLogWriteException ex)
                {
                    failure = ex;
                    Assert.Equal((seqBefore, hashBefore), (writer.LastSeq, writer.LastHash));
                }
            }
            Assert.NotNull(failure);
            output.WriteLine($"tmpfs 256 KiB, filler {filled} bytes; exposure log refused record {written + 1}: {failure.Reason}");
            Assert.Contains("No space left on device", failure.Reason, StringComparison.Ordinal);
            Assert.False(writer.IsHealthy);

            // Still full: the retry fails the same way and changes nothing.
            Assert.Throws<ExposureLogWriteException>(() => writer.Append(ExposureLogKinds.Snapshot, Start, Cause(written), Figures(written)));
            Assert.Equal(written, writer.LastSeq);

            disk.Free();
            var record = writer.Append(ExposureLogKinds.Snapshot, Start, Cause(written), Figures(written));
            written++;
            Assert.Equal(written, record.Seq);
            Assert.True(writer.IsHealthy);
            writer.Append(ExposureLogKinds.Snapshot, Start, Cause(written), Figures(written));
            written++;
        }

        var verification = ExposureLogVerifier.VerifyFolder(disk.Folder);
        Assert.True(verification.Intact, string.Join("; ", verification.Problems));
        Assert.Equal(written, verification.Records);
    }

    [Fact]
    public async Task Journal_append_on_a_full_disk_fails_cleanly_and_the_same_trade_is_written_once_when_space_is_freed()
    {
        using var folder = new WorkFolder();
        using var disk = TmpfsMount.Create(folder.Combine("journal"), 256 * 1024);
        var written = new List<string>();
        await using (var journal = new TradeJournal(new JournalOptions { Folder = disk.Folder }, TimeProvider.System))
        {
            for (var i = 0; i < 20; i++)
            {
                await journal.AppendTradeAsync(Trade(i));
                written.Add(Trade(i).TradeId);
            }
            disk.Fill();

            JournalWriteException? failure = null;
            var next = written.Count;
            for (var i = 0; i < 100 && failure is null; i++)
            {
                try
                {
                    await journal.AppendTradeAsync(Trade(next));
                    written.Add(Trade(next).TradeId);
                    next++;
                }
                catch (JournalWriteException ex)
                {
                    failure = ex;
                }
            }
            Assert.NotNull(failure);
            output.WriteLine($"journal refused trade {next + 1}: {failure.Reason}");
            Assert.Contains("No space left on device", failure.Reason, StringComparison.Ordinal);
            Assert.False(journal.IsHealthy);

            disk.Free();
            await journal.AppendTradeAsync(Trade(next)); // the redelivered message
            written.Add(Trade(next).TradeId);
            Assert.True(journal.IsHealthy);
        }

        var files = Directory.GetFiles(disk.Folder, "journal-*.jsonl");
        var contents = JournalReplay.ReadFile(Assert.Single(files));
        Assert.Empty(contents.Problems);
        Assert.Equal(written, contents.Trades.Select(t => t.TradeId));
        Assert.Equal(written.Count, contents.LastSeq);
    }

    [Fact]
    public async Task A_log_append_held_by_the_storage_gate_waits_out_the_full_disk_and_is_written_once()
    {
        using var folder = new WorkFolder();
        using var disk = TmpfsMount.Create(folder.Combine("log"), 256 * 1024);
        var gate = new StorageFaultGate(Options.Create(new StorageOptions()), TimeProvider.System, NullLogger<StorageFaultGate>.Instance);
        using var writer = new ExposureLogWriter(new ExposureLogOptions { Folder = disk.Folder, FlushToDisk = true }, TimeProvider.System);
        writer.Append(ExposureLogKinds.Snapshot, Start, Cause(0), Figures(0));
        disk.Fill();

        // Keep appending through the gate until one is held (the last page may take a few).
        var appended = 1;
        Task? held = null;
        var clock = Stopwatch.StartNew();
        while (held is null)
        {
            var n = appended;
            var run = gate.RunAsync(StorageFaultGate.ExposureLog, () => writer.Append(ExposureLogKinds.Snapshot, Start, Cause(n), Figures(n)), CancellationToken.None);
            while (!run.IsCompleted && !gate.IsFailing)
            {
                await Task.Delay(10);
            }
            if (gate.IsFailing)
            {
                held = run;
            }
            else
            {
                await run;
                appended++;
            }
            Assert.True(clock.Elapsed < TimeSpan.FromSeconds(30), "the full disk never refused an append");
        }
        var fault = Assert.Single(gate.Faults);
        output.WriteLine($"held: {fault}");
        Assert.Contains("No space left on device", fault.Reason, StringComparison.Ordinal);
        Assert.Contains(disk.Folder, fault.Path, StringComparison.Ordinal);
        Assert.False(held.IsCompleted);

        disk.Free();
        await held.WaitAsync(TimeSpan.FromSeconds(30));
        appended++;

        Assert.False(gate.IsFailing);
        Assert.Equal(appended, writer.LastSeq);
        var verification = ExposureLogVerifier.VerifyFolder(disk.Folder);
        Assert.True(verification.Intact, string.Join("; ", verification.Problems));
        Assert.Equal(appended, verification.Records);
    }

    private static ExposureLogCause Cause(int i) => new($"msg-{i}", "BondQuoted");

    // Invented figures of the invented scenario; about 300 bytes a record, so a 4 KiB page holds a dozen.
    private static JsonElement Figures(int i) => JsonSerializer.SerializeToElement(new
    {
        book = "RATES-CORE",
        curves = "gov:v12",
        dv01 = -1250.5 - i,
        value = 1_000_000.25 * i,
        note = new string('x', 120),
    });

    private static TradeInput Trade(int i) =>
        new($"DF-{i:D5}", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1_000_000, 99.5, Start);
}
