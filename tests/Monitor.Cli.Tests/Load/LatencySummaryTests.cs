using HdrHistogram;
using Monitor.Cli.Load;

namespace Monitor.Cli.Tests.Load;

/// <summary>
/// Percentiles read from HdrHistogram: for the values 1..N the p-th percentile is the value of rank ceil(p/100 N)
/// (nearest-rank definition, e.g. NIST/SEMATECH e-Handbook of Statistical Methods, 7.2.6.2, from memory), reported by
/// HdrHistogram within its relative precision: 3 significant digits = 0.1% (HdrHistogram README).
/// </summary>
public sealed class LatencySummaryTests
{
    [Fact]
    public void Percentiles_of_one_to_ten_thousand_microseconds_are_read_in_milliseconds()
    {
        var histogram = new LongHistogram(3_600_000_000, 3);
        for (var us = 1; us <= 10_000; us++)
        {
            histogram.RecordValue(us);
        }
        var s = LatencySummary.From("x", histogram);
        Assert.Equal(10_000, s.Count);
        Assert.Equal(5.0, s.P50Ms, 5.0 * 0.001);
        Assert.Equal(9.0, s.P90Ms, 9.0 * 0.001);
        Assert.Equal(9.9, s.P99Ms, 9.9 * 0.001);
        Assert.Equal(9.99, s.P999Ms, 9.99 * 0.001);
        Assert.Equal(10.0, s.MaxMs, 10.0 * 0.001);
    }

    [Fact]
    public void An_empty_histogram_gives_zeros()
    {
        var s = LatencySummary.From("empty", new LongHistogram(1000, 3));
        Assert.Equal(new LatencySummary("empty", 0, 0, 0, 0, 0, 0), s);
    }

    [Fact]
    public void The_recorder_keeps_one_outlier_as_the_max_and_clamps_negative_latencies_to_zero()
    {
        var recorder = new LatencyRecorder("r");
        for (var i = 0; i < 999; i++)
        {
            recorder.Record(TimeSpan.FromMilliseconds(2));
        }
        recorder.Record(TimeSpan.FromMilliseconds(-5));
        recorder.Record(TimeSpan.FromMilliseconds(250));
        var s = recorder.Summary();
        Assert.Equal(1001, s.Count);
        Assert.Equal(2.0, s.P99Ms, 2.0 * 0.001);
        Assert.Equal(250.0, s.MaxMs, 250.0 * 0.001);
    }
}
