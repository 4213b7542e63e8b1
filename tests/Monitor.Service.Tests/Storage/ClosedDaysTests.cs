using Monitor.Service.Audit;
using Monitor.Service.Storage;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Storage;

/// <summary>
/// Which days retention may move (issue 10, "Business days"): a day whose close record opens the next day file is
/// closed; a day from the journal's start-of-day state on is not (a restart replays it).
/// </summary>
public class ClosedDaysTests
{
    [Fact]
    public void A_day_closed_at_the_roll_is_closed_unless_a_restart_still_replays_it()
    {
        using var folder = new TempFolder();
        var log = folder.Combine("log");
        var journal = folder.Combine("journal");
        var clock = new ManualClock(new DateTimeOffset(2026, 6, 1, 15, 0, 0, TimeSpan.Zero));
        using (var writer = new ExposureLogWriter(TestKey.Value, new ExposureLogOptions { Folder = log, FlushToDisk = false }, clock))
        {
            writer.Append(ExposureLogKinds.Snapshot, clock.Now, new ExposureLogCause(null, "timer"), new Dictionary<string, object?> { ["book"] = "RATES-CORE" });
            clock.Now = new DateTimeOffset(2026, 6, 2, 0, 0, 0, TimeSpan.Zero); // the roll: the close lands in the next day's file
            writer.Append(ExposureLogKinds.CloseSnapshot, clock.Now, new ExposureLogCause(null, "timer"), new Dictionary<string, object?> { ["book"] = "RATES-CORE" });
            writer.Append(ExposureLogKinds.DayClosed, clock.Now, new ExposureLogCause(null, "day-roll"), new Dictionary<string, object?> { ["businessDate"] = "2026-06-01" });
        }

        Assert.True(new DayEndRecordClosedDays(log, TestKey.Value, journal).IsClosed(new DateOnly(2026, 6, 1), out var why), why);
        Assert.False(new DayEndRecordClosedDays(log, TestKey.Value, journal).IsClosed(new DateOnly(2026, 6, 2), out _));

        Directory.CreateDirectory(journal);
        File.WriteAllText(Path.Combine(journal, Monitor.Service.Journal.StartOfDayState.FileName), "{\"businessDate\":\"2026-06-01\",\"positionsSha256\":null}");
        Assert.False(new DayEndRecordClosedDays(log, TestKey.Value, journal).IsClosed(new DateOnly(2026, 6, 1), out why));
        Assert.Contains("start-of-day state of 2026-06-01", why, StringComparison.Ordinal);
    }
}
