using System.Globalization;
using Monitor.Service.Messaging;

namespace Monitor.Service.Engine;

/// <summary>
/// The latest applied version of every trade, so that at-least-once delivery has an exactly-once effect:
/// a redelivery changes nothing, an older version is ignored, a version gap or a different payload under
/// an applied id and version is refused, never guessed.
/// </summary>
public sealed class TradeRegister
{
    private readonly Dictionary<string, TradeInput> _latest = new(StringComparer.Ordinal);

    public int Count => _latest.Count;

    public TradeInput? Latest(string tradeId) => _latest.GetValueOrDefault(tradeId);

    /// <summary>Decides what an incoming trade does, without changing anything. Throws when it must be refused.</summary>
    public (TradeOutcome Outcome, TradeInput? Previous) Classify(TradeInput trade)
    {
        if (!_latest.TryGetValue(trade.TradeId, out var current))
        {
            if (trade.Action != TradeAction.New || trade.Version != 1)
            {
                throw new MessageRejectedException("version", trade.Version.ToString(CultureInfo.InvariantCulture),
                    $"is not applicable: trade {trade.TradeId} is unknown, so only a 'new' at version 1 can start it (a gap is held back, never guessed).");
            }
            return (TradeOutcome.Applied, null);
        }
        if (trade.Version == current.Version)
        {
            if (trade == current)
            {
                return (TradeOutcome.Duplicate, current);
            }
            throw new MessageRejectedException("version", trade.Version.ToString(CultureInfo.InvariantCulture),
                $"conflicts: trade {trade.TradeId} version {trade.Version} was applied with other values ({Differences(current, trade)}); send the change as the next version.");
        }
        if (trade.Version < current.Version)
        {
            return (TradeOutcome.Superseded, current);
        }
        if (trade.Version != current.Version + 1)
        {
            throw new MessageRejectedException("version", trade.Version.ToString(CultureInfo.InvariantCulture),
                $"leaves a gap: trade {trade.TradeId} is at version {current.Version}; send version {current.Version + 1} first.");
        }
        if (current.Action == TradeAction.Cancel)
        {
            throw new MessageRejectedException("action", trade.Action.ToString().ToLowerInvariant(),
                $"cannot follow the cancellation of trade {trade.TradeId} at version {current.Version}.");
        }
        if (trade.Action == TradeAction.New)
        {
            throw new MessageRejectedException("action", "new", $"cannot be version {trade.Version} of trade {trade.TradeId}; use amend or cancel.");
        }
        return (TradeOutcome.Applied, current);
    }

    public void Record(TradeInput trade) => _latest[trade.TradeId] = trade;

    /// <summary>The wire fields that differ, "book: applied RATES-CORE, received CREDIT-IG", times in ISO 8601.</summary>
    private static string Differences(TradeInput applied, TradeInput received)
    {
        var differences = new List<string>();
        Compare("action", applied.Action.ToString().ToLowerInvariant(), received.Action.ToString().ToLowerInvariant());
        Compare("book", applied.Book, received.Book);
        Compare("instrumentId", applied.InstrumentId, received.InstrumentId);
        Compare("faceAmount", Number(applied.FaceAmount), Number(received.FaceAmount));
        Compare("cleanPrice", Number(applied.CleanPrice), Number(received.CleanPrice));
        Compare("tradeTime", Time(applied.TradeTime), Time(received.TradeTime));
        return differences.Count == 0 ? "no field differs in its text" : string.Join("; ", differences);

        void Compare(string field, string a, string b)
        {
            if (!string.Equals(a, b, StringComparison.Ordinal))
            {
                differences.Add($"{field}: applied {a}, received {b}");
            }
        }
    }

    private static string Number(double value) => value.ToString("G17", CultureInfo.InvariantCulture);

    private static string Time(DateTimeOffset value) => value.ToString("yyyy-MM-dd'T'HH:mm:ss.FFFFFFFzzz", CultureInfo.InvariantCulture);
}
