namespace Monitor.Service.Audit;

/// <summary>
/// Verifies day files of the exposure log (format MXL-1): recomputes each record's hash, checks that
/// prevHash names the record before (across day files) and that seq runs on by one.
/// The record before a file's first record is the last record of the newest earlier day file in
/// the same folder; when there is none, the file starts the log: seq 1 and prevHash of 64 zeros.
/// </summary>
public static class ExposureLogVerifier
{
    /// <summary>Verifies one day file, linked to the previous day file in its folder if present.</summary>
    public static ExposureLogVerification VerifyFile(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var folder = Path.GetDirectoryName(Path.GetFullPath(path))!;
        var name = Path.GetFileName(path);
        var day = ExposureLogFiles.TryParseDay(name, out var d) ? d : (DateOnly?)null;
        var earlier = day is null ? [] : ExposureLogFiles.List(folder).Where(f => f.Day < day).ToList();
        return Verify([path], earlier);
    }

    /// <summary>Verifies the file of one business day in a folder.</summary>
    public static ExposureLogVerification VerifyDay(string folder, DateOnly day)
    {
        ArgumentNullException.ThrowIfNull(folder);
        return VerifyFile(ExposureLogFiles.PathOf(folder, day));
    }

    /// <summary>Verifies every day file in a folder (optionally only days from..to, inclusive), as one chain.</summary>
    public static ExposureLogVerification VerifyFolder(string folder, DateOnly? from = null, DateOnly? to = null)
    {
        ArgumentNullException.ThrowIfNull(folder);
        if (!Directory.Exists(folder))
        {
            var problem = new ExposureLogProblem(folder, 0, null, ExposureLogProblemKind.MissingFile, $"the folder '{folder}' does not exist.");
            return new ExposureLogVerification(false, 0, null, null, null, [], [problem]);
        }

        var all = ExposureLogFiles.List(folder);
        var inRange = all.Where(f => (from is null || f.Day >= from) && (to is null || f.Day <= to)).Select(f => f.Path).ToList();
        var earlier = all.Where(f => from is not null && f.Day < from).ToList();
        return Verify(inRange, earlier);
    }

    private static ExposureLogVerification Verify(IReadOnlyList<string> paths, IReadOnlyList<(DateOnly Day, string Path)> earlierFiles)
    {
        var chain = new ChainState(LinkBefore(earlierFiles));
        foreach (var path in paths)
        {
            chain.VerifyFile(path);
        }

        return chain.Result(paths.Select(Path.GetFileName).ToList()!);
    }

    /// <summary>The last record before the files verified: from the newest earlier non-empty day file.</summary>
    private static ChainLink? LinkBefore(IReadOnlyList<(DateOnly Day, string Path)> earlierFiles)
    {
        for (var i = earlierFiles.Count - 1; i >= 0; i--)
        {
            var path = earlierFiles[i].Path;
            var tail = ExposureLogTail.Read(path);
            if (tail.LastLine is null)
            {
                continue;
            }

            var parsed = ExposureLogLine.Parse(tail.LastLine);
            return parsed.Record is null
                ? new ChainLink(null, null, Path.GetFileName(path))
                : new ChainLink(parsed.Record.Seq, parsed.Record.Hash, Path.GetFileName(path));
        }

        return ChainLink.Start;
    }
}
