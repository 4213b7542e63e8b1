using Monitor.Analytics.Market;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Journal.JournalTestEngine;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Real failures that hold for root too (tests run as root in CI): a directory where the day file should be, a
/// folder path under a regular file, and a day file linked to /dev/full (every write fails with ENOSPC, as on a
/// full disk; Linux only). Each fails the awaited append, reports unhealthy, and recovers once the obstacle is gone.
/// </summary>
public sealed class JournalFailureTests
{
    private static readonly DateOnly Day = new(2026, 6, 1);

    [Fact]
    public async Task A_directory_in_place_of_the_day_file_fails_the_append_until_it_is_removed()
    {
        using var folder = new TempFolder();
        var dayPath = JournalFiles.PathOf(folder.Path, Day);
        Directory.CreateDirectory(dayPath);
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now));

        var ex = await Assert.ThrowsAsync<JournalWriteException>(() => journal.AppendTradeAsync(T("T-1")).AsTask());

        Assert.Equal(dayPath, ex.Path);
        Assert.False(string.IsNullOrWhiteSpace(ex.Reason));
        Assert.False(journal.IsHealthy);
        Assert.Contains(dayPath, journal.LastError, StringComparison.Ordinal);
        var health = await new JournalHealthCheck(journal).CheckHealthAsync(new HealthCheckContext());
        Assert.Equal(HealthStatus.Unhealthy, health.Status);

        Directory.Delete(dayPath);
        await journal.AppendTradeAsync(T("T-1"));
        Assert.True(journal.IsHealthy);
        Assert.Equal(HealthStatus.Healthy, (await new JournalHealthCheck(journal).CheckHealthAsync(new HealthCheckContext())).Status);
        Assert.Null(journal.LastError);
        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);
        Assert.Empty(contents.Problems);
        Assert.Equal(["T-1"], contents.Trades.Select(t => t.TradeId));
    }

    [Fact]
    public async Task A_folder_under_a_regular_file_fails_the_append_until_the_file_is_removed()
    {
        using var folder = new TempFolder();
        var blocker = folder.Combine("blocker");
        File.WriteAllText(blocker, "a file where a folder should be");
        var journalFolder = Path.Combine(blocker, "journal");
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = journalFolder }, new ManualClock(Now));

        var ex = await Assert.ThrowsAsync<JournalWriteException>(() => journal.AppendTradeAsync(T("T-1")).AsTask());

        Assert.StartsWith(journalFolder, ex.Path, StringComparison.Ordinal);
        Assert.False(journal.IsHealthy);

        File.Delete(blocker);
        await journal.AppendTradeAsync(T("T-1"));
        Assert.True(journal.IsHealthy);
        Assert.Equal(["T-1"], JournalReplay.Read(TestKey.Value, journalFolder, Day).Trades.Select(t => t.TradeId));
    }

    [Fact]
    public async Task A_full_disk_fails_the_whole_batch_and_the_journal_resumes_without_loss()
    {
        // /dev/full answers every write with ENOSPC ("No space left on device"), for root too (Linux only).
        if (!File.Exists("/dev/full"))
        {
            return;
        }
        using var folder = new TempFolder();
        var clock = new ManualClock(Now);
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, clock);
        await journal.AppendTradeAsync(T("T-1"));
        var nextDay = Day.AddDays(1);
        var nextPath = JournalFiles.PathOf(folder.Path, nextDay);
        File.CreateSymbolicLink(nextPath, "/dev/full");
        clock.Now = Now.AddDays(1);

        var failed = await Assert.ThrowsAsync<JournalWriteException>(() => journal.AppendTradeAsync(T("T-2")).AsTask());

        Assert.Equal(nextPath, failed.Path);
        Assert.False(journal.IsHealthy);
        Assert.Contains("No space left on device", journal.LastError, StringComparison.OrdinalIgnoreCase);

        File.Delete(nextPath); // space freed
        await journal.AppendTradeAsync(T("T-2")); // the redelivered message
        Assert.True(journal.IsHealthy);
        Assert.Equal(["T-1"], JournalReplay.Read(TestKey.Value, folder.Path, Day).Trades.Select(t => t.TradeId));
        var next = JournalReplay.Read(TestKey.Value, folder.Path, nextDay);
        Assert.Empty(next.Problems);
        Assert.Equal(["T-2"], next.Trades.Select(t => t.TradeId));
        Assert.Equal(1, next.LastSeq);
    }

    [Fact]
    public async Task Quotes_of_a_failed_batch_are_kept_and_written_once_the_folder_is_writable()
    {
        using var folder = new TempFolder();
        var dayPath = JournalFiles.PathOf(folder.Path, Day);
        Directory.CreateDirectory(dayPath); // no caller waits on a quote: the journal itself must keep it through the failure
        await using var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new ManualClock(Now));
        var quote = new BondQuote("VGB-2030-08", Now.AddMinutes(-5), 98.1, 98.2, null, null, "feed-a");

        journal.AppendQuote(quote);
        var waited = System.Diagnostics.Stopwatch.StartNew();
        while (journal.IsHealthy)
        {
            Assert.True(waited.Elapsed < TimeSpan.FromSeconds(30), "the quote's batch never failed"); // a safety net, not a speed check
            await Task.Delay(10);
        }
        Directory.Delete(dayPath);
        await journal.AppendTradeAsync(T("T-1"));

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, Day);
        Assert.Empty(contents.Problems);
        Assert.Equal(["T-1"], contents.Trades.Select(t => t.TradeId));
        Assert.Equal(quote, Assert.Single(contents.LatestQuotes).Value);
        Assert.Equal(2, contents.LastSeq);
        Assert.True(journal.IsHealthy);
    }

    private static TradeInput T(string id) => Trade(id, 1, TradeAction.New, "RATES-CORE", "VGB-2030-08", 1e6);
}
