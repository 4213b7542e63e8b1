using System.Globalization;
using Monitor.Faults.Tests.Support;
using Monitor.Service.Audit;
using Xunit.Abstractions;

namespace Monitor.Faults.Tests;

/// <summary>The checks both fault tests end with, and the figures they print (messages sent, faults, lost, duplicated).</summary>
internal static class FaultFigures
{
    /// <summary>
    /// Environment variable naming a file the figures lines are appended to (`.ci/run` sets it and prints the file at
    /// the end, so the CI log shows the figures whatever the test logger's verbosity).
    /// </summary>
    public const string FiguresFileVariable = "MONITOR_FIGURES_FILE";

    /// <summary>Writes a figures line to the test output and, when <see cref="FiguresFileVariable"/> is set, appends it to that file.</summary>
    public static void Report(ITestOutputHelper output, string line)
    {
        output.WriteLine(line);
        if (Environment.GetEnvironmentVariable(FiguresFileVariable) is { Length: > 0 } file)
        {
            File.AppendAllText(file, line + Environment.NewLine);
        }
    }

    public static async Task AssertNothingLostOrDuplicatedAsync(FaultRig rig, Publisher publisher, TradeStream stream, string fault, ITestOutputHelper output)
    {
        // Final face per (book, instrument): the stream's own arithmetic against what the service journalled.
        var expected = stream.ExpectedPositions();
        var actual = rig.ServicePositions(stream.StartOfDay);
        var wrong = expected.Keys.Union(actual.Keys)
            .Where(k => expected.GetValueOrDefault(k) != actual.GetValueOrDefault(k))
            .Select(k => $"{k.Book}/{k.Instrument}: expected {expected.GetValueOrDefault(k).ToString("R", CultureInfo.InvariantCulture)}, service {actual.GetValueOrDefault(k).ToString("R", CultureInfo.InvariantCulture)}")
            .ToList();

        // Every (trade, version) of the stream must be journalled; a trade applied twice shows as two trade-applied records.
        var journal = rig.JournalFiles();
        var journalled = journal.SelectMany(f => f.Trades).Select(t => (t.TradeId, t.Version)).ToHashSet();
        var sentVersions = stream.Messages.Where(m => m.TradeId is not null).Select(m => (m.TradeId!, m.Version)).ToList();
        var lost = sentVersions.Count(v => !journalled.Contains(v));
        var applied = rig.ExposureRecords(ExposureLogKinds.TradeApplied)
            .GroupBy(p => ((string)p["tradeId"]!, (int)p["version"]!))
            .ToDictionary(g => g.Key, g => g.Count());
        var duplicated = applied.Values.Count(c => c > 1);
        var notLogged = sentVersions.Count(v => !applied.ContainsKey(v));
        var journalProblems = journal.SelectMany(f => f.Problems).ToList();
        var errorQueued = 0u;
        foreach (var queue in FaultRig.InboundQueues)
        {
            errorQueued += await publisher.ReadyCountAsync(queue + "_error") ?? 0;
        }
        var verification = rig.VerifyExposureLog();
        var dayEnds = rig.ExposureRecords(ExposureLogKinds.StopSnapshot).Count;
        var fitted = rig.ExposureRecords(ExposureLogKinds.CurveFitted).Count;
        var rejected = rig.ExposureRecords(ExposureLogKinds.CurveRejected);

        Report(output, string.Create(CultureInfo.InvariantCulture,
            $"fault: {fault}; sent: {stream.Messages.Count} messages ({stream.TradeMessages} trade versions of {stream.LastVersions.Count} trades, {stream.QuoteMessages} quotes); " +
            $"lost: {lost}; duplicated: {duplicated}; refused to error queues: {errorQueued}; positions wrong: {wrong.Count} of {expected.Count}; " +
            $"trade versions without a trade-applied record: {notLogged}; journal problems: {journalProblems.Count}; exposure log: {verification.Records} records, intact {verification.Intact}; stop-snapshot records: {dayEnds}; curves fitted: {fitted}, rejected: {rejected.Count}"));
        foreach (var rejection in rejected.Take(3))
        {
            output.WriteLine($"curve rejected: {rejection.ToJsonString()}");
        }
        foreach (var problem in journalProblems)
        {
            output.WriteLine($"journal problem: {problem}");
        }

        Assert.True(wrong.Count == 0, "final positions differ from the stream's:\n" + string.Join('\n', wrong));
        Assert.Equal(0, lost);
        Assert.Equal(0, duplicated);
        // The audit trail too: start-up writes the records a kill between the journal's fsync and the log left out.
        Assert.True(notLogged == 0, $"{notLogged} journalled trade versions have no trade-applied record in the exposure log");
        Assert.Equal(0u, errorQueued);
        Assert.True(verification.Intact, "exposure log: " + string.Join("; ", verification.Problems.Select(p => p.ToString())));
        Assert.True(dayEnds > 0, "no stop-snapshot record: the graceful stop did not write its snapshot");
    }
}
