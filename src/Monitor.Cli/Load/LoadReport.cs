using System.Globalization;
using Monitor.Cli.Output;

namespace Monitor.Cli.Load;

/// <summary>Prints the results of <c>monitor load</c> as plain tables (latency in ms, rates in messages/s) or as JSON.</summary>
internal static class LoadReport
{
    /// <summary>The JSON document: the runs, and the service/bare throughput ratio when both ran.</summary>
    public sealed record Document(IReadOnlyList<PhaseResult> Runs, double? ThroughputRatio);

    /// <summary>Service consume rate over bare consume rate; null unless both ran and the bare rate is positive.</summary>
    public static double? Ratio(IReadOnlyList<PhaseResult> results)
    {
        ArgumentNullException.ThrowIfNull(results);
        var service = results.FirstOrDefault(r => r.Mode == "service");
        var bare = results.FirstOrDefault(r => r.Mode == "bare");
        return service is not null && bare is not null && bare.ConsumeRate > 0 ? service.ConsumeRate / bare.ConsumeRate : null;
    }

    public static void WriteJson(TextWriter output, IReadOnlyList<PhaseResult> results) => JsonOutput.Write(output, new Document(results, Ratio(results)));

    public static void WriteText(TextWriter output, IReadOnlyList<PhaseResult> results)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(results);
        var c = CultureInfo.InvariantCulture;
        foreach (var r in results)
        {
            output.WriteLine();
            output.WriteLine(string.Create(c, $"== {r.Mode}: paced {r.PacedQuotes} quotes in {r.PacedSeconds:F1} s ({r.AchievedRate:F0}/s), trades {r.TradesSent}; events: curve {r.CurveEvents}, status {r.StatusEvents}, books {r.BookEvents}; process CPU {r.CpuCores:F2} cores"));
            output.WriteLine(string.Create(c, $"{"latency (ms)",-40} {"count",8} {"p50",8} {"p90",8} {"p99",8} {"p99.9",8} {"max",8}"));
            foreach (var l in r.Latencies)
            {
                output.WriteLine(string.Create(c, $"{l.Name,-40} {l.Count,8} {l.P50Ms,8:F2} {l.P90Ms,8:F2} {l.P99Ms,8:F2} {l.P999Ms,8:F2} {l.MaxMs,8:F2}"));
            }
            output.WriteLine(string.Create(c, $"throughput: {r.ThroughputSent} quotes published at {r.PublishRate:F0}/s; {r.ThroughputConsumed} consumed in {r.ThroughputSeconds:F2} s = {r.ConsumeRate:F0}/s; consume faults {r.Faults}"));
        }
        if (Ratio(results) is { } ratio)
        {
            output.WriteLine();
            output.WriteLine(string.Create(c, $"service / bare throughput: {ratio:P1} (target >= 80%)"));
        }
    }
}
