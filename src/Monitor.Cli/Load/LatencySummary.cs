using HdrHistogram;

namespace Monitor.Cli.Load;

/// <summary>Percentiles of one latency histogram, in milliseconds (the histogram records microseconds).</summary>
internal sealed record LatencySummary(string Name, long Count, double P50Ms, double P90Ms, double P99Ms, double P999Ms, double MaxMs)
{
    /// <summary>Reads p50, p90, p99, p99.9 and max from <paramref name="histogram"/> (values in microseconds); all zero when it is empty.</summary>
    public static LatencySummary From(string name, HistogramBase histogram)
    {
        ArgumentNullException.ThrowIfNull(histogram);
        if (histogram.TotalCount == 0)
        {
            return new LatencySummary(name, 0, 0, 0, 0, 0, 0);
        }
        static double Ms(long micros) => micros / 1000.0;
        return new LatencySummary(
            name,
            histogram.TotalCount,
            Ms(histogram.GetValueAtPercentile(50)),
            Ms(histogram.GetValueAtPercentile(90)),
            Ms(histogram.GetValueAtPercentile(99)),
            Ms(histogram.GetValueAtPercentile(99.9)),
            Ms(histogram.GetMaxValue()));
    }
}
