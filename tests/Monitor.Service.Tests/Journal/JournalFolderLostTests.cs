using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Issue 10: "Deleting the log and journal folders while the service runs: writes go on into deleted files, health
/// Healthy". The journal now refuses to write into a file that is no longer the one on disk: the append fails loudly
/// (a storage failure, so the pipeline's gate reports <c>storage</c> Unhealthy and acknowledgements stop) and stays
/// failed, so nothing is acknowledged into a file that is gone.
/// </summary>
public sealed class JournalFolderLostTests
{
    private static readonly DateTimeOffset Now = new(2026, 6, 1, 17, 0, 0, TimeSpan.Zero);

    private static TradeInput Trade(string id) =>
        new(id, 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1_000_000, 99.5, Now.AddMinutes(-1));

    [Fact]
    public async Task Deleting_the_folder_under_a_running_journal_fails_every_later_append()
    {
        using var root = new TempFolder();
        var folder = Path.Combine(root.Path, "journal");
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder }, new ManualClock(Now));
        await journal.AppendTradeAsync(Trade("L-1"));
        Assert.True(journal.IsHealthy);

        Directory.Delete(folder, recursive: true);

        var ex = await Assert.ThrowsAsync<JournalWriteException>(async () => await journal.AppendTradeAsync(Trade("L-2")));
        Assert.Contains("deleted while the service was writing it", ex.Message, StringComparison.Ordinal);
        Assert.False(journal.IsHealthy);
        // The folder comes back empty: still refused (a new file would silently start a second chain for the day).
        Directory.CreateDirectory(folder);
        await Assert.ThrowsAsync<JournalWriteException>(async () => await journal.AppendTradeAsync(Trade("L-3")));
        Assert.False(File.Exists(journal.PathOf(DateOnly.FromDateTime(Now.UtcDateTime))));
    }

    [Fact]
    public async Task A_day_file_replaced_under_a_running_journal_is_refused()
    {
        using var root = new TempFolder();
        var folder = Path.Combine(root.Path, "journal");
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder }, new ManualClock(Now));
        await journal.AppendTradeAsync(Trade("L-1"));
        var path = journal.PathOf(DateOnly.FromDateTime(Now.UtcDateTime));
        File.Delete(path);
        File.WriteAllText(path, "a different file\n");

        var ex = await Assert.ThrowsAsync<JournalWriteException>(async () => await journal.AppendTradeAsync(Trade("L-2")));

        Assert.Contains("was replaced or changed", ex.Message, StringComparison.Ordinal);
    }
}

