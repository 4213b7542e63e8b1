using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// The engine as the service starts it: built from the start-of-day files, then brought up to date from every
/// journal day since the start-of-day state (<see cref="StartOfDayState"/>): trades and instrument definitions in
/// journal order (trades by version, so a trade seen twice counts once) and the latest quotes refitted. Built once,
/// before any consumer runs.
/// </summary>
public sealed record EngineRecovery(RiskEngine Engine, JournalContents Journal, JournalRecoveryResult Result)
{
    /// <summary>The start-of-day state the replay started from.</summary>
    public StartOfDayState? StartOfDay { get; init; }

    public static EngineRecovery Start(RiskEngine engine, JournalOptions journal, BusinessDayRoll roll, string? positionsFile, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(engine);
        ArgumentNullException.ThrowIfNull(journal);
        ArgumentNullException.ThrowIfNull(roll);
        var today = roll.BusinessDateOf(now);
        var state = StartOfDayState.Resolve(journal.Folder, positionsFile, today);
        var contents = JournalReplay.ReadFrom(journal.Folder, state.BusinessDate, today);
        return new EngineRecovery(engine, contents, JournalRecovery.Rebuild(engine, contents, now)) { StartOfDay = state };
    }
}
