using HdrHistogram;

namespace Monitor.Cli.Load;

/// <summary>A thread-safe HdrHistogram of latencies in microseconds, 1 us to 1 hour at 3 significant digits.</summary>
internal sealed class LatencyRecorder(string name)
{
    private static readonly long Highest = TimeSpan.FromHours(1).Ticks / TimeSpan.TicksPerMicrosecond;
    private readonly LongHistogram _histogram = new(Highest, 3);
    private readonly Lock _lock = new();

    public string Name { get; } = name;

    /// <summary>Records <paramref name="latency"/>; negative values (clock steps) count as zero, values above an hour as an hour.</summary>
    public void Record(TimeSpan latency)
    {
        var micros = Math.Clamp(latency.Ticks / TimeSpan.TicksPerMicrosecond, 0, Highest);
        lock (_lock)
        {
            _histogram.RecordValue(micros);
        }
    }

    public LatencySummary Summary()
    {
        lock (_lock)
        {
            return LatencySummary.From(Name, _histogram);
        }
    }
}
