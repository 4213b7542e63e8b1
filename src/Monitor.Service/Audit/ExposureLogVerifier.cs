using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// Verifies day files of the exposure log (format exposure-log/2): recomputes each record's HMAC-SHA256 under the
/// record key, checks that prevMac names the record before (across day files) and that seq runs on by one.
/// The record before a file's first record is the last record of the newest earlier day file in
/// the same folder; when there is none, the file starts the log: seq 1 and prevMac of 64 zeros.
/// Given the checkpoint folder, every verified checkpoint must find its record (day file, seq, mac, position in the
/// day): a cut tail, a deleted day file and a rewrite from before a checkpoint show; records after the newest
/// checkpoint are counted as unanchored.
/// </summary>
public static class ExposureLogVerifier
{
    /// <summary>Verifies one day file, linked to the previous day file in its folder if present.</summary>
    public static ExposureLogVerification VerifyFile(RecordKey key, string path)
    {
        ArgumentNullException.ThrowIfNull(key);
        ArgumentNullException.ThrowIfNull(path);
        var folder = Path.GetDirectoryName(Path.GetFullPath(path))!;
        var name = Path.GetFileName(path);
        var day = ExposureLogFiles.TryParseDay(name, out var d) ? d : (DateOnly?)null;
        var earlier = day is null ? [] : ExposureLogFiles.List(folder).Where(f => f.Day < day).ToList();
        var chain = new ChainState(key, LinkBefore(key, earlier));
        chain.VerifyFile(path);
        return chain.Result([name]);
    }

    /// <summary>Verifies the file of one business day in a folder.</summary>
    public static ExposureLogVerification VerifyDay(RecordKey key, string folder, DateOnly day)
    {
        ArgumentNullException.ThrowIfNull(folder);
        return VerifyFile(key, ExposureLogFiles.PathOf(folder, day));
    }

    /// <summary>
    /// Verifies every day file in a folder (optionally only days from..to, inclusive) as one chain, and against the
    /// checkpoints in <paramref name="checkpointFolder"/> (those of the days verified) when given.
    /// </summary>
    public static ExposureLogVerification VerifyFolder(
        RecordKey key, string folder, DateOnly? from = null, DateOnly? to = null, string? checkpointFolder = null)
    {
        ArgumentNullException.ThrowIfNull(key);
        ArgumentNullException.ThrowIfNull(folder);
        if (!Directory.Exists(folder))
        {
            var problem = new ExposureLogProblem(folder, 0, null, ExposureLogProblemKind.MissingFile, $"the folder '{folder}' does not exist.");
            return new ExposureLogVerification(false, 0, null, null, null, [], [problem]);
        }

        bool InRange(DateOnly day) => (from is null || day >= from) && (to is null || day <= to);
        var all = ExposureLogFiles.List(folder);
        var inRange = all.Where(f => InRange(f.Day)).ToList();
        var earlier = all.Where(f => from is not null && f.Day < from).ToList();
        var checkpoints = new List<(string File, int Line, ExposureLogCheckpoint Checkpoint)>();
        var checkpointProblems = new List<ExposureLogProblem>();
        if (checkpointFolder is not null)
        {
            foreach (var (file, line, checkpoint, problem) in ExposureLogCheckpointFiles.ReadAll(checkpointFolder, key))
            {
                if (checkpoint is null)
                {
                    checkpointProblems.Add(new ExposureLogProblem(file, line, null, ExposureLogProblemKind.CheckpointUnverifiable, problem!));
                }
                else if (InRange(checkpoint.Day))
                {
                    checkpoints.Add((file, line, checkpoint));
                }
            }
        }

        var chain = new ChainState(key, LinkBefore(key, earlier), checkpoints.Select(c => c.Checkpoint.Seq).ToHashSet());
        foreach (var (_, path) in inRange)
        {
            chain.VerifyFile(path);
        }

        long? anchored = null;
        foreach (var (file, line, checkpoint) in checkpoints)
        {
            var problem = Check(checkpoint, chain, inRange.Select(f => f.Day).ToHashSet());
            if (problem is null)
            {
                anchored = Math.Max(anchored ?? 0, checkpoint.Seq);
            }
            else
            {
                checkpointProblems.Add(new ExposureLogProblem(file, line, checkpoint.Seq, problem.Value.Kind, problem.Value.Detail));
            }
        }

        foreach (var problem in checkpointProblems)
        {
            chain.AddProblem(problem);
        }

        var result = chain.Result(inRange.Select(f => Path.GetFileName(f.Path)).ToList());
        var firstSeq = result.FirstSeq ?? 0;
        var unanchored = result.LastSeq is not { } last ? 0 : anchored is { } a ? Math.Max(0, last - a) : last - firstSeq + 1;
        return result with { Checkpoints = checkpoints.Count, AnchoredSeq = anchored, Unanchored = unanchored };
    }

    private static (ExposureLogProblemKind Kind, string Detail)? Check(ExposureLogCheckpoint checkpoint, ChainState chain, IReadOnlySet<DateOnly> days)
    {
        var dayFile = ExposureLogFiles.FileName(checkpoint.Day);
        if (!days.Contains(checkpoint.Day))
        {
            return (ExposureLogProblemKind.DayFileMissing,
                $"the checkpoint of {checkpoint.Time:O} ({checkpoint.Reason}) anchors seq {checkpoint.Seq} in {dayFile}, which is not in the log folder: the day file was deleted.");
        }
        if (!chain.Anchors.TryGetValue(checkpoint.Seq, out var found))
        {
            return chain.LastSeq is not { } last || checkpoint.Seq > last
                ? (ExposureLogProblemKind.TailCut,
                    $"the checkpoint of {checkpoint.Time:O} ({checkpoint.Reason}) anchors seq {checkpoint.Seq}, but the log ends at seq {chain.LastSeq?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? "(none)"}: records were cut off the end.")
                : (ExposureLogProblemKind.CheckpointMismatch,
                    $"the checkpoint of {checkpoint.Time:O} ({checkpoint.Reason}) anchors seq {checkpoint.Seq} in {dayFile}, but no record has that seq: records were removed.");
        }
        if (!string.Equals(found.Mac, checkpoint.Mac, StringComparison.Ordinal))
        {
            return (ExposureLogProblemKind.CheckpointMismatch,
                $"the record at seq {checkpoint.Seq} ({found.File} line {found.Line}) has mac {found.Mac}, but the checkpoint of {checkpoint.Time:O} ({checkpoint.Reason}) says {checkpoint.Mac}: the log was rewritten from this record or before.");
        }
        if (!string.Equals(found.File, dayFile, StringComparison.Ordinal) || found.Line != checkpoint.DayRecords)
        {
            return (ExposureLogProblemKind.CheckpointMismatch,
                $"the record at seq {checkpoint.Seq} is line {found.Line} of {found.File}, but the checkpoint says record {checkpoint.DayRecords} of {dayFile}: records were moved, added or removed in that day.");
        }
        return null;
    }

    /// <summary>The last record before the files verified: from the newest earlier non-empty day file.</summary>
    private static ChainLink? LinkBefore(RecordKey key, IReadOnlyList<(DateOnly Day, string Path)> earlierFiles)
    {
        for (var i = earlierFiles.Count - 1; i >= 0; i--)
        {
            var path = earlierFiles[i].Path;
            var tail = ExposureLogTail.Read(path);
            if (tail.LastLine is null)
            {
                continue;
            }

            var parsed = ExposureLogLine.Parse(key, tail.LastLine);
            return parsed.Record is null
                ? new ChainLink(null, null, Path.GetFileName(path))
                : new ChainLink(parsed.Record.Seq, parsed.Record.Mac, Path.GetFileName(path));
        }

        return ChainLink.Start;
    }
}
