namespace Monitor.Cli.Load;

/// <summary>
/// The figures of one run (service or bare): paced latency percentiles, event counts, and the max-rate throughput phase.
/// <paramref name="CpuCores"/>: this process's CPU time over the measured paced run divided by its length (1.0 = one
/// core busy), publisher and event consumer included; a steadier figure than the latencies on a shared machine.
/// </summary>
internal sealed record PhaseResult(
    string Mode,
    long PacedQuotes,
    double PacedSeconds,
    double AchievedRate,
    IReadOnlyList<LatencySummary> Latencies,
    long CurveEvents,
    long StatusEvents,
    long BookEvents,
    long TradesSent,
    long ThroughputSent,
    double PublishRate,
    long ThroughputConsumed,
    double ConsumeRate,
    double ThroughputSeconds,
    long Faults,
    double CpuCores = 0);
