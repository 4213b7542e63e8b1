using Monitor.Analytics.Market;
using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// Reads a journal day file back for a restart. Never throws for bad content: a torn last line (no LF: a write
/// cut short by a crash, whose append never completed) is dropped, and a line failing its hash or unparsable is
/// skipped; each is reported in <see cref="JournalContents.Problems"/>. Throws <see cref="IOException"/> only when
/// the file exists but cannot be read.
/// </summary>
public static class JournalReplay
{
    public static JournalContents Read(string folder, DateOnly day) => ReadFile(JournalFiles.PathOf(folder, day));

    /// <summary>Every day file of the folder from <paramref name="firstDay"/> on, oldest first, read as one.</summary>
    public static JournalContents ReadFrom(string folder, DateOnly firstDay, DateOnly today) =>
        JournalContents.Join([.. JournalFiles.List(folder).Where(f => f.Day >= firstDay).Select(f => ReadFile(f.Path))], JournalFiles.PathOf(folder, today));

    public static JournalContents ReadFile(string path)
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
        return Parse(path, bytes);
    }

    internal static JournalContents Parse(string path, ReadOnlySpan<byte> bytes)
    {
        var name = System.IO.Path.GetFileName(path);
        var changes = new List<JournalRecord>();
        var quotes = new Dictionary<string, BondQuote>(StringComparer.Ordinal);
        var problems = new List<JournalProblem>();
        long lastSeq = 0;
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
            var record = JournalLine.Parse(line, out var kind, out var detail);
            if (record is null)
            {
                problems.Add(new JournalProblem(kind!.Value, name, lineNumber, offset, detail + " Line skipped."));
            }
            else
            {
                if (record.Seq != lastSeq + 1)
                {
                    problems.Add(new JournalProblem(JournalProblemKind.SequenceGap, name, lineNumber, offset,
                        $"seq {record.Seq} follows seq {lastSeq}; lines are missing or out of order."));
                }
                lastSeq = record.Seq;
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
        return new JournalContents(path, changes, quotes, problems, lastSeq, complete).WithDays([path]);
    }
}
