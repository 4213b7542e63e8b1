using System.Globalization;

namespace Monitor.Cli.Demo;

/// <summary>The demo's closing summary as plain text: counts, status changes by kind, breach durations, the final books and the log check.</summary>
internal static class DemoSummary
{
    public static void Write(TextWriter output, DemoOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(outcome);
        var inv = CultureInfo.InvariantCulture;
        output.WriteLine();
        output.WriteLine(outcome.Interrupted ? "=== Demo interrupted: summary so far ===" : "=== Demo summary ===");
        output.WriteLine(string.Create(inv, $"Simulated {DemoScenario.TradeDate:yyyy-MM-dd} {DemoFormat.Clock(DemoScenario.DayStart)}-{DemoFormat.Clock(outcome.Final.SimulatedTime < DemoScenario.DayEnd ? outcome.Final.SimulatedTime : DemoScenario.DayEnd)} UTC in {outcome.RealElapsed.TotalSeconds:F1} s real time."));
        output.WriteLine(string.Create(inv, $"Quotes sent through the bus {outcome.Quotes} (after the opening quotes file), trades sent {outcome.Trades}, curves fitted {outcome.Fits} (quotes left out as outliers {outcome.Outliers}), refits refused {outcome.Rejections}."));
        output.WriteLine(string.Create(inv, $"Limit status changes: {outcome.Changes.Count} (warnings {outcome.Count(StatusChangeKind.Warning)}, breaches {outcome.Count(StatusChangeKind.Breach)}, clears {outcome.Count(StatusChangeKind.Clear)})"));
        foreach (var change in outcome.Changes)
        {
            output.WriteLine("  " + DemoFormat.StatusLine(change));
        }
        output.WriteLine("Breaches (simulated time in breach):");
        var any = false;
        foreach (var (limit, from, to) in Breaches(outcome.Changes))
        {
            any = true;
            output.WriteLine(to is { } end
                ? $"  {limit}: {DemoFormat.Clock(from)} to {DemoFormat.Clock(end)}, {DemoFormat.Duration(end - from)}"
                : $"  {limit}: from {DemoFormat.Clock(from)}, still in breach at the close");
        }
        if (!any)
        {
            output.WriteLine("  none");
        }
        output.WriteLine("Books at the close (XTS; per-bp figures in XTS per bp):");
        output.WriteLine($"  {"book",-12} {"value",14} {"DV01",10} {"level",10} {"slope",10} {"curvature",10} {"spread lvl",10} {"limit use",9}");
        foreach (var b in outcome.Final.Books)
        {
            output.WriteLine($"  {b.Book,-12} {DemoFormat.Money(b.Value),14} {DemoFormat.Money(b.Dv01),10} {DemoFormat.Money(b.BaseLevel),10} {DemoFormat.Money(b.BaseSlope),10} {DemoFormat.Money(b.BaseCurvature),10} {DemoFormat.Money(b.SpreadLevel),10} {DemoFormat.Percent(b.MaxUse),9}{b.Mark}");
        }
        if (outcome.Final.Books.Any(b => b.Provisional))
        {
            output.WriteLine("  " + BookRow.ProvisionalLegend);
        }
        output.WriteLine("Limits at the close:");
        // Columns as wide as their longest entry, so a long spread group name does not push the figures out of line.
        var idWidth = outcome.Final.Limits.Select(l => l.Id.Length).DefaultIfEmpty(0).Max();
        var scopeWidth = outcome.Final.Limits.Select(l => l.Scope.Length).DefaultIfEmpty(0).Max();
        var measureWidth = outcome.Final.Limits.Select(l => l.Measure.Length).DefaultIfEmpty(0).Max();
        foreach (var l in outcome.Final.Limits)
        {
            output.WriteLine($"  {l.Id.PadRight(idWidth)} {l.Scope.PadRight(scopeWidth)} {l.Measure.PadRight(measureWidth)} {DemoFormat.Money(l.Exposure),14} of {(l.Bound is { } bound ? DemoFormat.Money(bound) : "-"),13} {DemoFormat.Percent(l.Use),7} {l.Status}");
        }
        output.WriteLine("Curves at the close: " + string.Join(", ", outcome.Final.Curves.Select(c =>
            string.Create(inv, $"{c.Curve} v{c.Version} RMSE {(c.RmseBp is { } r ? r.ToString("F2", inv) : "-")} bp"))));
        var v = outcome.Verification;
        output.WriteLine(v.Intact
            ? $"Exposure log {outcome.ExposureLogFolder}: intact, {v.Records} records, seq {v.FirstSeq}..{v.LastSeq}, anchored by {v.Checkpoints} checkpoint(s) up to seq {v.AnchoredSeq?.ToString(inv) ?? "-"}, {v.Unanchored} unanchored"
            : $"Exposure log {outcome.ExposureLogFolder}: NOT intact, {v.Problems.Count} problem(s): {string.Join("; ", v.Problems.Select(p => $"{p.Kind} at {p.File}:{p.LineNumber}"))}");
        output.WriteLine($"Check it again: dotnet run --project src/Monitor.Cli -- verify-log \"{outcome.ExposureLogFolder}\" --key-file \"{outcome.KeyFile}\" --checkpoints \"{outcome.CheckpointFolder}\"");
        output.WriteLine($"Working folder (config copy, record key record.key, exposure log and its checkpoints, service log monitor.log): {outcome.WorkDir}");
    }

    /// <summary>Each breach with the event time it started and the time it stepped down (null when it never did).</summary>
    public static IEnumerable<(string Limit, DateTimeOffset From, DateTimeOffset? To)> Breaches(IReadOnlyList<ObservedStatusChange> changes)
    {
        ArgumentNullException.ThrowIfNull(changes);
        var open = new Dictionary<string, DateTimeOffset>(StringComparer.Ordinal);
        var result = new List<(string, DateTimeOffset, DateTimeOffset?)>();
        foreach (var c in changes.OrderBy(c => c.Message.EventTime))
        {
            var m = c.Message;
            if (m.Status == "breach" && m.PreviousStatus != "breach")
            {
                open[m.LimitId] = m.EventTime;
            }
            else if (m.PreviousStatus == "breach" && m.Status != "breach" && open.Remove(m.LimitId, out var from))
            {
                result.Add((m.LimitId, from, m.EventTime));
            }
        }
        result.AddRange(open.Select(p => (p.Key, p.Value, (DateTimeOffset?)null)));
        return result;
    }
}
