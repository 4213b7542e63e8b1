using Monitor.Analytics.Market;
using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// What a day file holds after replay: the trades in file order, the latest quote per instrument
/// (latest quote time; a later line wins a tie), and the problems found (lines dropped or out of sequence).
/// </summary>
public sealed class JournalContents
{
    public JournalContents(string path, IReadOnlyList<TradeInput> trades, IReadOnlyDictionary<string, BondQuote> latestQuotes,
        IReadOnlyList<JournalProblem> problems, long lastSeq, long completeLength)
    {
        Path = path;
        Trades = trades;
        LatestQuotes = latestQuotes;
        Problems = problems;
        LastSeq = lastSeq;
        CompleteLength = completeLength;
    }

    /// <summary>The day file read (it may not exist: then everything is empty).</summary>
    public string Path { get; }

    public IReadOnlyList<TradeInput> Trades { get; }

    public IReadOnlyDictionary<string, BondQuote> LatestQuotes { get; }

    public IReadOnlyList<JournalProblem> Problems { get; }

    /// <summary>The <c>seq</c> of the last good line; 0 for an empty or missing file.</summary>
    public long LastSeq { get; }

    /// <summary>Bytes up to and including the last line feed: what stays when a torn tail is cut off.</summary>
    public long CompleteLength { get; }

    /// <summary>The mac of the last good line (64 zeros for an empty or missing file): the next line's prevMac.</summary>
    public string LastMac { get; init; } = JournalLine.Genesis;

    public static JournalContents Empty(string path) =>
        new(path, [], new Dictionary<string, BondQuote>(StringComparer.Ordinal), [], 0, 0);
}
