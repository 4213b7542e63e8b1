using Monitor.Analytics.Market;
using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>One journal line read back: its sequence number and either a trade or a quote.</summary>
public sealed record JournalRecord(long Seq, DateTimeOffset WrittenTime, TradeInput? Trade, BondQuote? Quote);
