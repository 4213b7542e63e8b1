using System.Text;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Journal.JournalTestEngine;

namespace Monitor.Service.Tests.Journal;

/// <summary>What replay does with a day file damaged by a crash (torn tail) or on disk (changed line).</summary>
public sealed class JournalReplayTests
{
    private static readonly DateOnly Day = new(2026, 6, 1);

    [Fact]
    public async Task A_torn_last_line_is_dropped_reported_and_cut_off_by_the_next_writer()
    {
        using var folder = new TempFolder();
        await WriteTradesAsync(folder.Path, 5);
        var path = JournalFiles.PathOf(folder.Path, Day);
        var bytes = File.ReadAllBytes(path);
        var lastLineStart = Array.LastIndexOf(bytes, (byte)'\n', bytes.Length - 2) + 1;
        var cut = lastLineStart + ((bytes.Length - lastLineStart) / 2); // a crash in the middle of the fifth line
        File.WriteAllBytes(path, bytes[..cut]);

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Equal(["T-0", "T-1", "T-2", "T-3"], contents.Trades.Select(t => t.TradeId));
        var problem = Assert.Single(contents.Problems);
        Assert.Equal(JournalProblemKind.TornTail, problem.Kind);
        Assert.Equal(lastLineStart, problem.ByteOffset);
        Assert.Equal(lastLineStart, contents.CompleteLength);

        // The fifth append never completed, so its message was not acknowledged: the broker redelivers it.
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now)))
        {
            await journal.AppendTradeAsync(Trade("T-4", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1e6));
            Assert.Equal(JournalProblemKind.TornTail, Assert.Single(journal.Repairs).Kind);
        }
        var repaired = JournalReplay.Read(TestKey.Value, folder.Path, Day);
        Assert.Empty(repaired.Problems);
        Assert.Equal(["T-0", "T-1", "T-2", "T-3", "T-4"], repaired.Trades.Select(t => t.TradeId));
        Assert.Equal(5, repaired.LastSeq);
    }

    [Fact]
    public async Task A_changed_line_fails_its_hash_is_reported_and_not_applied()
    {
        using var folder = new TempFolder();
        await WriteTradesAsync(folder.Path, 4);
        var path = JournalFiles.PathOf(folder.Path, Day);
        var lines = File.ReadAllLines(path, Encoding.UTF8);
        Assert.Contains("\"faceAmount\":1000001,", lines[1], StringComparison.Ordinal);
        lines[1] = lines[1].Replace("\"faceAmount\":1000001,", "\"faceAmount\":9000001,", StringComparison.Ordinal); // still valid JSON
        File.WriteAllText(path, string.Join('\n', lines) + "\n");

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Equal(["T-0", "T-2", "T-3"], contents.Trades.Select(t => t.TradeId));
        var mismatch = Assert.Single(contents.Problems, p => p.Kind == JournalProblemKind.MacMismatch);
        Assert.Equal(2, mismatch.LineNumber);
        // The next good line (seq 3) no longer follows the last good one (seq 1): reported as well.
        Assert.Contains(contents.Problems, p => p.Kind == JournalProblemKind.SequenceGap && p.LineNumber == 3);
    }

    [Fact]
    public async Task A_line_that_is_not_a_record_is_reported_and_skipped()
    {
        using var folder = new TempFolder();
        await WriteTradesAsync(folder.Path, 2);
        var path = JournalFiles.PathOf(folder.Path, Day);
        var text = File.ReadAllText(path);
        var firstEnd = text.IndexOf('\n', StringComparison.Ordinal) + 1;
        File.WriteAllText(path, text[..firstEnd] + "not a journal line\n" + text[firstEnd..]);

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Equal(["T-0", "T-1"], contents.Trades.Select(t => t.TradeId));
        Assert.Equal(JournalProblemKind.Unparsable, Assert.Single(contents.Problems).Kind);
    }

    [Fact]
    public void A_missing_day_file_reads_as_empty()
    {
        using var folder = new TempFolder();

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);

        Assert.Empty(contents.Trades);
        Assert.Empty(contents.LatestQuotes);
        Assert.Empty(contents.Problems);
        Assert.Equal(0, contents.LastSeq);
    }

    private static async Task WriteTradesAsync(string folder, int count)
    {
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder }, new ManualClock(Now));
        for (var i = 0; i < count; i++)
        {
            await journal.AppendTradeAsync(Trade($"T-{i}", 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1_000_000 + i));
        }
    }
}
