namespace Monitor.Cli.Load;

/// <summary>The figures of one run (service or bare): paced latency percentiles, event counts, and the max-rate throughput phase.</summary>
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
    long Faults);
