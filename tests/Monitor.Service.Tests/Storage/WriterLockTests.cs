using Monitor.Service.Storage;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Storage;

/// <summary>
/// One writer per folder (issue 10: two instances on the same folders both started and overwrote each other's journal):
/// a second service on the same exposure-log and journal folders does not start, and says which folder and who holds it.
/// Two services in one test process: .NET takes <see cref="FileShare.None"/> as flock(LOCK_EX) per open on Linux, so
/// two opens in one process conflict as two processes would.
/// </summary>
public sealed class WriterLockTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task A_second_service_on_the_same_folders_does_not_start_and_names_the_folder_and_the_holder()
    {
        await using var first = await ServiceUnderTest.StartAsync(root: _folder.Path);

        var refused = await Assert.ThrowsAnyAsync<Exception>(() => ServiceUnderTest.StartAsync(root: _folder.Path));

        var inUse = Find(refused);
        Assert.Equal(Path.GetFullPath(first.LogFolder), inUse.Folder);
        Assert.Contains(first.LogFolder, inUse.Message, StringComparison.Ordinal);
        Assert.Contains($"\"pid\":{Environment.ProcessId}", inUse.Message, StringComparison.Ordinal);
        Assert.Contains("startedAt", inUse.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_lock_file_left_by_a_killed_process_does_not_block_a_restart()
    {
        // What a killed service leaves: its lock and holder files, with no process holding the OS lock.
        foreach (var folder in new[] { "exposure-log", "exposure-log-journal" })
        {
            Directory.CreateDirectory(_folder.Combine(folder));
            var holder = """{"pid":999999,"startedAt":"2026-06-01T07:00:00.0000000+00:00","host":"gone"}""";
            await File.WriteAllTextAsync(Path.Combine(_folder.Combine(folder), FolderWriterLock.LockFileName), holder);
            await File.WriteAllTextAsync(Path.Combine(_folder.Combine(folder), FolderWriterLock.HolderFileName), holder);
        }

        await using (var restarted = await ServiceUnderTest.StartAsync(root: _folder.Path))
        {
            Assert.True(restarted.VerifyLog().Intact);
        }

        // Disposing the service released its locks: the next start takes them again.
        await using var again = await ServiceUnderTest.StartAsync(root: _folder.Path);
        Assert.Contains($"\"pid\":{Environment.ProcessId}", await File.ReadAllTextAsync(Path.Combine(again.LogFolder, FolderWriterLock.HolderFileName)), StringComparison.Ordinal);
    }

    [Fact]
    public void The_lock_is_held_until_disposed_and_only_the_lock_counts()
    {
        var folder = _folder.Combine("log");
        var held = FolderWriterLock.Take(folder, "exposure log");
        Assert.Throws<FolderInUseException>(() => FolderWriterLock.Take(folder, "exposure log"));
        held.Dispose();
        Assert.True(File.Exists(Path.Combine(folder, FolderWriterLock.LockFileName))); // the file stays, the lock does not
        FolderWriterLock.Take(folder, "exposure log").Dispose();
    }

    private static FolderInUseException Find(Exception exception) => exception switch
    {
        FolderInUseException inUse => inUse,
        AggregateException aggregate => aggregate.InnerExceptions.Select(Find).First(),
        _ => Find(exception.InnerException ?? throw new Xunit.Sdk.XunitException($"no FolderInUseException in {exception}")),
    };
}
