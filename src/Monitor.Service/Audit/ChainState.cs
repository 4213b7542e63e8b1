using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// Walks day files line by line, checking each record's MAC under the key and its link to the record before it,
/// and notes where the records named by checkpoints are (seq, mac, file, line within the file).
/// </summary>
internal sealed class ChainState(RecordKey key, ChainLink? before, IReadOnlySet<long>? anchoredSeqs = null)
{
    private readonly List<ExposureLogProblem> _problems = [];
    private readonly Dictionary<long, (string Mac, string File, int Line)> _anchors = [];
    private ChainLink? _previous = before;
    private int _records;
    private long? _firstSeq;
    private long? _lastSeq;
    private string? _lastMac;

    /// <summary>Where the records with a checkpoint's seq were found: their mac, file name and line number.</summary>
    public IReadOnlyDictionary<long, (string Mac, string File, int Line)> Anchors => _anchors;

    public long? LastSeq => _lastSeq;

    public void AddProblem(ExposureLogProblem problem) => _problems.Add(problem);

    public void VerifyFile(string path)
    {
        var name = Path.GetFileName(path);
        if (!File.Exists(path))
        {
            _problems.Add(new ExposureLogProblem(name, 0, null, ExposureLogProblemKind.MissingFile, $"'{path}' does not exist."));
            return;
        }

        byte[] bytes;
        using (var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite))
        {
            // ReadWrite sharing: today's file may be open in the writer. A record caught mid-write shows as a torn line.
            bytes = new byte[stream.Length];
            stream.ReadExactly(bytes);
        }
        var start = 0;
        var lineNumber = 0;
        while (start < bytes.Length)
        {
            lineNumber++;
            var feed = Array.IndexOf(bytes, (byte)'\n', start);
            if (feed < 0)
            {
                _problems.Add(new ExposureLogProblem(
                    name, lineNumber, null, ExposureLogProblemKind.TornLine,
                    $"the last {bytes.Length - start} bytes have no line feed: a write was cut short (crash or full disk)."));
                _previous = new ChainLink(null, null, $"{name} line {lineNumber}");
                return;
            }

            VerifyLine(name, lineNumber, bytes.AsSpan(start, feed - start));
            start = feed + 1;
        }
    }

    public ExposureLogVerification Result(IReadOnlyList<string> files) =>
        new(_problems.Count == 0, _records, _firstSeq, _lastSeq, _lastMac, files, _problems.ToList());

    private void VerifyLine(string name, int lineNumber, ReadOnlySpan<byte> line)
    {
        var where = $"{name} line {lineNumber}";
        var parsed = ExposureLogLine.Parse(key, line);
        if (parsed.Record is not { } record)
        {
            _problems.Add(new ExposureLogProblem(name, lineNumber, null, ExposureLogProblemKind.Unparsable, parsed.Error!));
            _previous = new ChainLink(null, null, where);
            return;
        }

        _records++;
        _firstSeq ??= record.Seq;
        _lastSeq = record.Seq;
        _lastMac = record.Mac;
        if (anchoredSeqs is not null && anchoredSeqs.Contains(record.Seq))
        {
            _anchors.TryAdd(record.Seq, (record.Mac, name, lineNumber));
        }

        if (!parsed.MacMatches)
        {
            _problems.Add(new ExposureLogProblem(
                name, lineNumber, record.Seq, ExposureLogProblemKind.MacMismatch,
                $"stored mac {record.Mac}, computed {parsed.ComputedMac} under the record key: the record was written or changed by someone without the key (or the key is not the log's)."));
        }

        if (_previous is { Seq: { } previousSeq, Mac: { } previousMac } previous)
        {
            if (record.Seq != previousSeq + 1)
            {
                _problems.Add(new ExposureLogProblem(
                    name, lineNumber, record.Seq, ExposureLogProblemKind.SequenceGap,
                    $"seq {record.Seq} follows seq {previousSeq} ({previous.Where}): expected {previousSeq + 1}."));
            }

            if (!string.Equals(record.PrevMac, previousMac, StringComparison.Ordinal))
            {
                _problems.Add(new ExposureLogProblem(
                    name, lineNumber, record.Seq, ExposureLogProblemKind.BrokenLink,
                    $"prevMac {record.PrevMac} is not the mac {previousMac} of the record before ({previous.Where})."));
            }
        }

        _previous = new ChainLink(record.Seq, record.Mac, where);
    }
}
