namespace Monitor.Cli.Load;

/// <summary>
/// Options of <c>monitor load</c>: broker, paced rate (quotes/s) and length (s) of the latency phase after a warm-up,
/// number of books, mode, message count of the max-rate throughput phase, a trade every <see cref="TradeEvery"/>
/// quotes (service mode), the service's conflation window, the working folder, whether the service's exposure log fsyncs
/// (its default), and the service's book-figure interval (default its own, 1 s).
/// </summary>
internal sealed record LoadOptions(
    BrokerAddress Broker,
    double Rate,
    double Seconds,
    int Books,
    LoadMode Mode,
    long ThroughputCount,
    double WarmupSeconds,
    int TradeEvery,
    TimeSpan ConflationWindow,
    string WorkDir,
    bool LogFlushToDisk = true,
    int Seed = 20261201,
    TimeSpan? BookEventInterval = null)
{
    /// <summary>Most sends in flight in the throughput phase (each waits for the broker's publisher confirm).</summary>
    public const int MaxInFlight = 100;

    public static string DefaultWorkDir(DateTimeOffset now) =>
        Path.Combine(Path.GetTempPath(), "monitor-load-" + now.ToString("yyyyMMdd-HHmmss", System.Globalization.CultureInfo.InvariantCulture));
}
