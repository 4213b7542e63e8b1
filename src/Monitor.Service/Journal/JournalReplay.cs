using Monitor.Analytics.Market;
using Monitor.Service.Engine;
using Monitor.Service.Storage;

namespace Monitor.Service.Journal;

/// <summary>
/// Reads a journal day file back for a restart. Never throws for bad content: a torn last line (no LF: a write
/// cut short by a crash, whose append never completed) is dropped, a line failing its MAC or unparsable is left out,
/// a line out of sequence or chain is kept; each is reported in <see cref="JournalContents.Problems"/> (the start
/// refuses a journal with any problem but a torn tail: <see cref="JournalRejectedException"/>). Throws
/// <see cref="IOException"/> only when the file exists but cannot be read.
/// </summary>
public static class JournalReplay
{
    public static JournalContents Read(RecordKey key, string folder, DateOnly day) => ReadFile(key, JournalFiles.PathOf(folder, day));

    /// <summary>Every day file of the folder from <paramref name="firstDay"/> on, oldest first, read as one.</summary>
    public static JournalContents ReadFrom(RecordKey key, string folder, DateOnly firstDay, DateOnly today) =>
        JournalContents.Join([.. JournalFiles.List(folder).Where(f => f.Day >= firstDay).Select(f => ReadFile(key, f.Path))], JournalFiles.PathOf(folder, today));

    public static JournalContents ReadFile(RecordKey key, string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (!File.Exists(path))
        {
            return JournalContents.Empty(path);
        }
        byte[] bytes;
        using (var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete))
        {
            bytes = new byte[stream.Length];
            stream.ReadExactly(bytes);
        }
        return Parse(key, path, bytes);
    }

    internal static JournalContents Parse(RecordKey key, string path, ReadOnlySpan<byte> bytes)
    {
        var name = System.IO.Path.GetFileName(path);
        var changes = new List<JournalRecord>();
        var quotes = new Dictionary<string, BondQuote>(StringComparer.Ordinal);
        var problems = new List<JournalProblem>();
        long lastSeq = 0;
        var lastMac = JournalLine.Genesis;
        var offset = 0;
        var lineNumber = 0;
        while (offset < bytes.Length)
        {
            var end = bytes[offset..].IndexOf((byte)'\n');
            if (end < 0)
            {
                problems.Add(new JournalProblem(JournalProblemKind.TornTail, name, lineNumber + 1, offset,
                    $"{bytes.Length - offset} bytes after the last line feed dropped (a write cut short; its append never completed)."));
                break;
            }
            lineNumber++;
            var line = bytes.Slice(offset, end);
            var record = JournalLine.Parse(key, line, out var kind, out var detail, out var tradeId);
            if (record is null)
            {
                problems.Add(new JournalProblem(kind!.Value, name, lineNumber, offset, detail) { TradeId = tradeId });
            }
            else
            {
                if (record.Seq != lastSeq + 1)
                {
                    problems.Add(new JournalProblem(JournalProblemKind.SequenceGap, name, lineNumber, offset,
                        $"seq {record.Seq} follows seq {lastSeq}; lines are missing or out of order.") { TradeId = tradeId });
                }
                else if (!string.Equals(record.PrevMac, lastMac, StringComparison.Ordinal))
                {
                    problems.Add(new JournalProblem(JournalProblemKind.BrokenLink, name, lineNumber, offset,
                        $"prevMac {record.PrevMac} is not the mac of the line before; lines were removed, inserted or moved.") { TradeId = tradeId });
                }
                lastSeq = record.Seq;
                lastMac = record.Mac;
                if (record.Trade is not null || record.Definition is not null)
                {
                    changes.Add(record with { File = name });
                }
                else if (record.Quote is { } quote
                    && (!quotes.TryGetValue(quote.InstrumentId, out var kept) || kept.QuoteTime <= quote.QuoteTime))
                {
                    quotes[quote.InstrumentId] = quote;
                }
            }
            offset += end + 1;
        }
        var complete = bytes.LastIndexOf((byte)'\n') + 1;
        return new JournalContents(path, changes, quotes, problems, lastSeq, complete) { LastMac = lastMac }.WithDays([path]);
    }
}
