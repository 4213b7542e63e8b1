using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// What one or more day files hold after replay: the trades and instrument definitions in file order (days oldest
/// first), the latest quote per instrument (latest quote time; a later line wins a tie), and the problems found
/// (lines dropped or out of sequence).
/// </summary>
public sealed class JournalContents
{
    public JournalContents(string path, IReadOnlyList<JournalRecord> changes, IReadOnlyDictionary<string, BondQuote> latestQuotes,
        IReadOnlyList<JournalProblem> problems, long lastSeq, long completeLength)
    {
        Path = path;
        Changes = changes;
        Trades = changes.Where(c => c.Trade is not null).Select(c => c.Trade!).ToArray();
        Definitions = changes.Where(c => c.Definition is not null).Select(c => c.Definition!).ToArray();
        LatestQuotes = latestQuotes;
        Problems = problems;
        LastSeq = lastSeq;
        CompleteLength = completeLength;
    }

    /// <summary>The (newest) day file read (it may not exist: then everything is empty).</summary>
    public string Path { get; }

    /// <summary>The day files read, oldest first (one for a single day).</summary>
    public IReadOnlyList<string> Days { get; private init; } = [];

    /// <summary>Trades and instrument definitions in journal order: the order replay applies them in.</summary>
    public IReadOnlyList<JournalRecord> Changes { get; }

    public IReadOnlyList<TradeInput> Trades { get; }

    public IReadOnlyList<Bond> Definitions { get; }

    public IReadOnlyDictionary<string, BondQuote> LatestQuotes { get; }

    public IReadOnlyList<JournalProblem> Problems { get; }

    /// <summary>The <c>seq</c> of the last good line; 0 for an empty or missing file.</summary>
    public long LastSeq { get; }

    /// <summary>Bytes up to and including the last line feed: what stays when a torn tail is cut off.</summary>
    public long CompleteLength { get; }

    /// <summary>The mac of the last good line (64 zeros for an empty or missing file): the next line's prevMac.</summary>
    public string LastMac { get; init; } = JournalLine.Genesis;

    public static JournalContents Empty(string path) =>
        new(path, [], new Dictionary<string, BondQuote>(StringComparer.Ordinal), [], 0, 0) { Days = [path] };

    /// <summary>Several day files, oldest first, read as one: changes in day order, the latest quote over all of them.</summary>
    public static JournalContents Join(IReadOnlyList<JournalContents> days, string emptyPath)
    {
        ArgumentNullException.ThrowIfNull(days);
        if (days.Count == 0)
        {
            return Empty(emptyPath);
        }
        var quotes = new Dictionary<string, BondQuote>(StringComparer.Ordinal);
        foreach (var quote in days.SelectMany(d => d.LatestQuotes.Values))
        {
            if (!quotes.TryGetValue(quote.InstrumentId, out var kept) || kept.QuoteTime <= quote.QuoteTime)
            {
                quotes[quote.InstrumentId] = quote;
            }
        }
        var last = days[^1];
        return new JournalContents(last.Path, [.. days.SelectMany(d => d.Changes)], quotes, [.. days.SelectMany(d => d.Problems)], last.LastSeq, last.CompleteLength)
        {
            Days = [.. days.Select(d => d.Path)],
            LastMac = last.LastMac,
        };
    }

    internal JournalContents WithDays(IReadOnlyList<string> days) =>
        new(Path, Changes, LatestQuotes, Problems, LastSeq, CompleteLength) { Days = days, LastMac = LastMac };
}
