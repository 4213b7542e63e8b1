namespace Monitor.Service.Audit;

/// <summary>Walks day files line by line, checking each record against the one before it.</summary>
internal sealed class ChainState(ChainLink? before)
{
    private readonly List<ExposureLogProblem> _problems = [];
    private ChainLink? _previous = before;
    private int _records;
    private long? _firstSeq;
    private long? _lastSeq;
    private string? _lastHash;

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
        new(_problems.Count == 0, _records, _firstSeq, _lastSeq, _lastHash, files, _problems.ToList());

    private void VerifyLine(string name, int lineNumber, ReadOnlySpan<byte> line)
    {
        var where = $"{name} line {lineNumber}";
        var parsed = ExposureLogLine.Parse(line);
        if (parsed.Record is not { } record)
        {
            _problems.Add(new ExposureLogProblem(name, lineNumber, null, ExposureLogProblemKind.Unparsable, parsed.Error!));
            _previous = new ChainLink(null, null, where);
            return;
        }

        _records++;
        _firstSeq ??= record.Seq;
        _lastSeq = record.Seq;
        _lastHash = record.Hash;
        if (!parsed.HashMatches)
        {
            _problems.Add(new ExposureLogProblem(
                name, lineNumber, record.Seq, ExposureLogProblemKind.HashMismatch,
                $"stored hash {record.Hash}, computed {parsed.ComputedHash}: the record was changed after it was written."));
        }

        if (_previous is { Seq: { } previousSeq, Hash: { } previousHash } previous)
        {
            if (record.Seq != previousSeq + 1)
            {
                _problems.Add(new ExposureLogProblem(
                    name, lineNumber, record.Seq, ExposureLogProblemKind.SequenceGap,
                    $"seq {record.Seq} follows seq {previousSeq} ({previous.Where}): expected {previousSeq + 1}."));
            }

            if (!string.Equals(record.PrevHash, previousHash, StringComparison.Ordinal))
            {
                _problems.Add(new ExposureLogProblem(
                    name, lineNumber, record.Seq, ExposureLogProblemKind.BrokenLink,
                    $"prevHash {record.PrevHash} is not the hash {previousHash} of the record before ({previous.Where})."));
            }
        }

        _previous = new ChainLink(record.Seq, record.Hash, where);
    }
}
