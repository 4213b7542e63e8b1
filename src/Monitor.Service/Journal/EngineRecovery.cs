using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Storage;

namespace Monitor.Service.Journal;

/// <summary>
/// The engine as the service starts it: built from the start-of-day files, then brought up to date from every
/// journal day since the start-of-day state (<see cref="StartOfDayState"/>): trades and instrument definitions in
/// journal order (trades by version, so a trade already in the positions file or seen twice counts once) and the
/// latest quotes refitted. Built once, before any consumer runs. Fails closed: a journal line failing its check
/// (anything but a torn last line) in any replayed day, or a trade the exposure log records as applied on a replayed
/// day that the books do not hold, stops the start with <see cref="JournalRejectedException"/>, unless
/// <see cref="JournalOptions.AcceptLoss"/> is set, in which case each loss is kept in <see cref="Losses"/> for the
/// start to write to the exposure log.
/// </summary>
public sealed record EngineRecovery(RiskEngine Engine, JournalContents Journal, JournalRecoveryResult Result)
{
    /// <summary>The start-of-day state the replay started from.</summary>
    public StartOfDayState? StartOfDay { get; init; }

    /// <summary>What was lost and let through under <see cref="JournalOptions.AcceptLoss"/> (empty otherwise).</summary>
    public IReadOnlyList<string> Losses { get; init; } = [];

    /// <exception cref="JournalRejectedException">A bad journal line, or the books disagree with the exposure log.</exception>
    public static EngineRecovery Start(RiskEngine engine, RecordKey key, JournalOptions journal, ExposureLogOptions log,
        BusinessDayRoll roll, string? positionsFile, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(engine);
        ArgumentNullException.ThrowIfNull(journal);
        ArgumentNullException.ThrowIfNull(log);
        ArgumentNullException.ThrowIfNull(roll);
        var today = roll.BusinessDateOf(now);
        var state = StartOfDayState.Resolve(journal.Folder, positionsFile, today);
        var contents = JournalReplay.ReadFrom(key, journal.Folder, state.BusinessDate, today);
        var bad = contents.Problems.Where(p => p.Kind != JournalProblemKind.TornTail).Select(p => p.ToString()).ToList();
        if (bad.Count > 0 && !journal.AcceptLoss)
        {
            throw new JournalRejectedException(
                $"The trade journal ({string.Join(", ", contents.Days.Select(System.IO.Path.GetFileName))}) has {bad.Count} line(s) failing their check; the start is stopped so that no trade is silently lost or forged:"
                + Environment.NewLine + "  " + string.Join(Environment.NewLine + "  ", bad) + Environment.NewLine + WayForward);
        }
        var result = JournalRecovery.Rebuild(engine, contents, now);
        // Every replayed business day's trade-applied records, not today's only: the books rebuilt from the start-of-day
        // state must hold everything the log says was applied since then.
        var differing = Differing(engine, LoggedTrades.ReadDays(log.Folder, state.BusinessDate, today));
        if (differing.Count > 0 && !journal.AcceptLoss)
        {
            throw new JournalRejectedException(
                $"After replaying the journal from {state.BusinessDate:yyyy-MM-dd} to {today:yyyy-MM-dd} the books do not hold {differing.Count} trade(s) that the exposure log in {log.Folder} records as applied on those days:"
                + Environment.NewLine + "  " + string.Join(Environment.NewLine + "  ", differing) + Environment.NewLine + WayForward);
        }
        return new EngineRecovery(engine, contents, result) { StartOfDay = state, Losses = [.. bad, .. differing] };
    }

    /// <summary>The documented ways to proceed (Journal/README.md, "When the start is refused").</summary>
    public const string WayForward =
        "To proceed: restore the journal day file from its archive or backup copy and start again; or, when no good copy exists, "
        + "move the bad file aside, start once with Journal:AcceptLoss=true (environment Journal__AcceptLoss=true), which writes every "
        + "lost line and trade to the exposure log as a journal-loss record, re-book the trades named above, and unset the option.";

    /// <summary>Trades the log records as applied (trade id, version) that the engine's register does not hold at that version or later.</summary>
    private static List<string> Differing(RiskEngine engine, IReadOnlyCollection<(string TradeId, int Version)> logged)
    {
        var differing = new List<string>();
        foreach (var (tradeId, version) in logged.OrderBy(t => t.TradeId, StringComparer.Ordinal).ThenBy(t => t.Version))
        {
            var held = engine.Trades.Latest(tradeId);
            if (held is null || held.Version < version)
            {
                differing.Add($"trade {tradeId} v{version}: logged as applied, but the books hold {(held is null ? "no version of it" : $"only v{held.Version}")}.");
            }
        }
        return differing;
    }
}
