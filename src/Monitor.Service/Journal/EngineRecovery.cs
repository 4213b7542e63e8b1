using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// The engine as the service starts it: built from the start-of-day files, then brought up to date from today's
/// trade journal (trades replayed by version, so a trade already in the positions file or seen twice counts once,
/// and the latest quotes refitted). Built once, before any consumer runs.
/// </summary>
public sealed record EngineRecovery(RiskEngine Engine, JournalContents Journal, JournalRecoveryResult Result)
{
    public static EngineRecovery Start(RiskEngine engine, JournalOptions journal, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(engine);
        ArgumentNullException.ThrowIfNull(journal);
        var contents = JournalReplay.Read(journal.Folder, JournalFiles.DayOf(now, journal.BusinessDayUtcOffset));
        return new EngineRecovery(engine, contents, JournalRecovery.Rebuild(engine, contents, now));
    }
}
