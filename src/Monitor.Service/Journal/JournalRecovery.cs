using Monitor.Service.Engine;
using Monitor.Service.Messaging;

namespace Monitor.Service.Journal;

/// <summary>
/// Replays journal days into an engine that holds the start-of-day state (instruments, positions): the trades and
/// instrument definitions in journal order through <see cref="RiskEngine.ApplyTrade"/> (idempotent thanks to the
/// versions: a trade already in the engine is a duplicate) and <see cref="RiskEngine.DefineInstrument"/>; a refusal of
/// either stops the start (<see cref="JournalReplayRefusedException"/>, naming the file, seq, id and reason); then the kept quotes through <see cref="RiskEngine.AcceptQuote"/> and
/// one <see cref="RiskEngine.RefitDirtyCurves"/>. Pure: uses only the engine's public methods, no I/O, no clock.
/// </summary>
public static class JournalRecovery
{
    public static JournalRecoveryResult Rebuild(RiskEngine engine, JournalContents contents, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(engine);
        ArgumentNullException.ThrowIfNull(contents);
        int applied = 0, duplicates = 0, superseded = 0, quotes = 0;
        var definitions = 0;
        var rejectedQuotes = new List<string>();
        foreach (var change in contents.Changes)
        {
            if (change.Definition is { } bond)
            {
                try
                {
                    engine.DefineInstrument(bond);
                    definitions++;
                }
                catch (MessageRejectedException ex)
                {
                    throw new JournalReplayRefusedException(change.File, change.Seq, $"instrument definition {bond.Id}", ex.Message, ex);
                }
                continue;
            }
            var trade = change.Trade!;
            try
            {
                switch (engine.ApplyTrade(trade, now).Trade)
                {
                    case TradeOutcome.Applied:
                        applied++;
                        break;
                    case TradeOutcome.Duplicate:
                        duplicates++;
                        break;
                    case TradeOutcome.Superseded:
                        superseded++;
                        break;
                }
            }
            catch (MessageRejectedException ex)
            {
                // Accepted when journalled, refused now: the start-of-day files changed (e.g. a book left the limits file). Fail closed.
                throw new JournalReplayRefusedException(change.File, change.Seq, $"trade {trade.TradeId} v{trade.Version}", ex.Message, ex);
            }
        }
        foreach (var quote in contents.LatestQuotes.Values.OrderBy(q => q.InstrumentId, StringComparer.Ordinal))
        {
            try
            {
                engine.AcceptQuote(quote, now);
                quotes++;
            }
            catch (MessageRejectedException ex)
            {
                // e.g. more than 7 days old by now, or its instrument is no longer defined.
                rejectedQuotes.Add($"quote {quote.InstrumentId} {quote.QuoteTime:O}: {ex.Message}");
            }
        }
        var refit = engine.RefitDirtyCurves(now);
        return new JournalRecoveryResult(applied, duplicates, superseded, definitions, quotes, rejectedQuotes, refit);
    }
}
