using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>One journal line read back: its sequence number and a trade, a quote or an instrument definition.</summary>
public sealed record JournalRecord(long Seq, DateTimeOffset WrittenTime, TradeInput? Trade, BondQuote? Quote, Bond? Definition = null)
{
    /// <summary>The day file it was read from (file name), for messages.</summary>
    public string File { get; init; } = string.Empty;

    /// <summary>mac of the line before in the day file (64 zeros for the first line).</summary>
    public string PrevMac { get; init; } = string.Empty;

    /// <summary>This line's HMAC-SHA256 under the record key.</summary>
    public string Mac { get; init; } = string.Empty;
}
