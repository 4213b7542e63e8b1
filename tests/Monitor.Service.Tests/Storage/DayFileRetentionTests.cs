using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using Monitor.Service.Audit;
using Monitor.Service.Hosting;
using Monitor.Service.Storage;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Storage;

/// <summary>
/// Retention of the exposure-log and journal day files: the newest <c>Retention:DaysKept</c> business days stay, older
/// closed days move to the archive (both files of a day), nothing is deleted or overwritten, and the current day and
/// days not closed never move. Found on the landed main: both folders grew one file a day with no bound or rule.
/// </summary>
public sealed class DayFileRetentionTests : IDisposable
{
    private static readonly DateOnly Today = DateOnly.FromDateTime(TestMarket.Now.UtcDateTime);
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private string LogFolder => _folder.Combine("exposure-log");

    private string JournalFolder => _folder.Combine("exposure-log-journal");

    private string Archive => _folder.Combine("archive");

    [Fact]
    public void Closed_days_beyond_the_days_kept_move_to_the_archive_with_their_journal()
    {
        WriteDays(Today.AddDays(-5), 6, closedUpTo: Today.AddDays(-1));
        var before = Enumerable.Range(-5, 6).ToDictionary(d => Today.AddDays(d), d => File.ReadAllBytes(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(d))));

        var outcome = Retention(daysKept: 3).Apply(Today);

        Assert.Equal(6, outcome.Moved.Count);
        Assert.Empty(outcome.Kept);
        for (var d = -5; d <= -3; d++)
        {
            var day = Today.AddDays(d);
            Assert.False(File.Exists(ExposureLogFiles.PathOf(LogFolder, day)));
            Assert.False(File.Exists(JournalPath(JournalFolder, day)));
            Assert.Equal(before[day], File.ReadAllBytes(ExposureLogFiles.PathOf(Path.Combine(Archive, "exposure-log"), day)));
            Assert.True(File.Exists(JournalPath(Path.Combine(Archive, "journal"), day)));
        }
        for (var d = -2; d <= 0; d++)
        {
            Assert.True(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(d))));
            Assert.True(File.Exists(JournalPath(JournalFolder, Today.AddDays(d))));
        }
        // Run again: nothing more to move.
        Assert.Empty(Retention(daysKept: 3).Apply(Today).Moved);
    }

    [Fact]
    public void A_day_that_is_not_closed_stays_with_the_reason()
    {
        WriteDays(Today.AddDays(-3), 4, closedUpTo: Today.AddDays(-1), open: Today.AddDays(-3));
        File.WriteAllText(JournalPath(JournalFolder, Today.AddDays(-4)), "{}\n"); // a journal day without its log file

        var outcome = Retention(daysKept: 1).Apply(Today);

        Assert.Equal(2, outcome.Kept.Count);
        Assert.Contains(outcome.Kept, k => k.Day == Today.AddDays(-3) && k.Why.Contains("'snapshot'", StringComparison.Ordinal));
        Assert.Contains(outcome.Kept, k => k.Day == Today.AddDays(-4) && k.Why.Contains("no exposure-log file", StringComparison.Ordinal));
        Assert.True(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(-3))));
        Assert.True(File.Exists(JournalPath(JournalFolder, Today.AddDays(-4))));
        Assert.False(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(-2))));
        Assert.False(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(-1))));
    }

    [Fact]
    public void The_current_day_and_later_days_never_move()
    {
        WriteDays(Today.AddDays(-1), 3, closedUpTo: Today.AddDays(1));

        var outcome = Retention(daysKept: 1).Apply(Today);

        Assert.Equal([ExposureLogFiles.PathOf(LogFolder, Today.AddDays(-1)), JournalPath(JournalFolder, Today.AddDays(-1))], outcome.Moved.Select(m => m.From).ToArray());
        Assert.True(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today)));
        Assert.True(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(1))));
    }

    [Fact]
    public void A_file_already_in_the_archive_is_never_overwritten()
    {
        WriteDays(Today.AddDays(-2), 3, closedUpTo: Today.AddDays(-1));
        var clash = JournalPath(Path.Combine(Archive, "journal"), Today.AddDays(-2));
        Directory.CreateDirectory(Path.GetDirectoryName(clash)!);
        File.WriteAllText(clash, "older copy\n");

        var outcome = Retention(daysKept: 2).Apply(Today);

        Assert.Empty(outcome.Moved);
        Assert.Contains("already in the archive", Assert.Single(outcome.Kept).Why, StringComparison.Ordinal);
        Assert.Equal("older copy\n", File.ReadAllText(clash));
        Assert.True(File.Exists(ExposureLogFiles.PathOf(LogFolder, Today.AddDays(-2))));
        Assert.True(File.Exists(JournalPath(JournalFolder, Today.AddDays(-2))));
    }

    [Fact]
    public async Task The_service_archives_old_closed_days_at_start()
    {
        // 32 closed days before today, and today's file written at start (opening fit): with the default 30 days kept,
        // the oldest (-32, -31, and -30 when today has files) go at start.
        var root = _folder.Combine("service");
        WriteDays(Today.AddDays(-32), 32, closedUpTo: Today.AddDays(-1), logFolder: Path.Combine(root, "exposure-log"), journalFolder: Path.Combine(root, "exposure-log-journal"));

        await using (await ServiceUnderTest.StartAsync(root: root))
        {
            var archive = Path.Combine(root, "exposure-log-archive");
            Assert.True(File.Exists(ExposureLogFiles.PathOf(Path.Combine(archive, "exposure-log"), Today.AddDays(-32))));
            Assert.True(File.Exists(JournalPath(Path.Combine(archive, "journal"), Today.AddDays(-31))));
            Assert.False(File.Exists(ExposureLogFiles.PathOf(Path.Combine(root, "exposure-log"), Today.AddDays(-31))));
            Assert.True(File.Exists(ExposureLogFiles.PathOf(Path.Combine(root, "exposure-log"), Today.AddDays(-29))));
            Assert.True(File.Exists(ExposureLogFiles.PathOf(Path.Combine(root, "exposure-log"), Today)));
        }
    }

    [Theory]
    [InlineData("Retention:DaysKept", "0", "Retention:DaysKept: 0")]
    [InlineData("Retention:ArchiveFolder", "LOG/old", "Retention:ArchiveFolder: ")]
    [InlineData("Retention:ArchiveFolder", "LOG", "overlaps ExposureLog:Folder")]
    public async Task Bad_retention_settings_stop_the_start_naming_the_key(string key, string value, string expected)
    {
        var settings = ServiceUnderTest.Settings(LogFolder);
        settings[key] = value.Replace("LOG", LogFolder, StringComparison.Ordinal);
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(settings).Build();
        var builder = Host.CreateEmptyApplicationBuilder(new HostApplicationBuilderSettings());
        builder.Services.AddMonitorService(configuration);
        using var host = builder.Build();
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));

        var ex = await Assert.ThrowsAnyAsync<Exception>(() => host.StartAsync(timeout.Token));
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }

    private DayFileRetention Retention(int daysKept) =>
        new(new RetentionOptions { DaysKept = daysKept, ArchiveFolder = Archive }, LogFolder, JournalFolder,
            new DayEndRecordClosedDays(LogFolder, TestKey.Value), NullLogger<DayFileRetention>.Instance);

    private static string JournalPath(string folder, DateOnly day) => Monitor.Service.Journal.JournalFiles.PathOf(folder, day);

    /// <summary>
    /// Real exposure-log day files (one chain, a snapshot each day, a service-stopped record on the days up to
    /// <paramref name="closedUpTo"/> except <paramref name="open"/>) and a journal file beside each day.
    /// </summary>
    private void WriteDays(DateOnly first, int count, DateOnly closedUpTo, DateOnly? open = null, string? logFolder = null, string? journalFolder = null)
    {
        logFolder ??= LogFolder;
        journalFolder ??= JournalFolder;
        Directory.CreateDirectory(journalFolder);
        var clock = new FakeTimeProvider(new DateTimeOffset(first.ToDateTime(new TimeOnly(9, 0)), TimeSpan.Zero));
        using var writer = new ExposureLogWriter(TestKey.Value, new ExposureLogOptions { Folder = logFolder, FlushToDisk = false }, clock);
        for (var i = 0; i < count; i++)
        {
            var day = first.AddDays(i);
            clock.SetUtcNow(new DateTimeOffset(day.ToDateTime(new TimeOnly(9, 0)), TimeSpan.Zero));
            writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), new ExposureLogCause(null, "timer"), new Dictionary<string, object?> { ["book"] = "RATES-CORE" });
            if (day <= closedUpTo && day != open)
            {
                clock.SetUtcNow(new DateTimeOffset(day.ToDateTime(new TimeOnly(18, 0)), TimeSpan.Zero));
                writer.Append(ExposureLogKinds.ServiceStopped, clock.GetUtcNow(), new ExposureLogCause(null, "timer"), new Dictionary<string, object?> { ["book"] = "RATES-CORE" });
            }
            File.WriteAllText(JournalPath(journalFolder, day), "{}\n");
        }
    }
}
