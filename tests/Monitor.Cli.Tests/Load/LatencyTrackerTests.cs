using System.Diagnostics;
using Monitor.Cli.Load;

namespace Monitor.Cli.Tests.Load;

/// <summary>
/// Matching events to quotes by CauseMessageId. The service names the latest quote of a conflation window as a refit's
/// cause (RiskPipeline.RefitAsync takes the pending cause with the latest event time), so every quote published up to
/// that one is reflected in the fit: common practice for conflated feeds, no source.
/// </summary>
public sealed class LatencyTrackerTests
{
    private static readonly long Ms = Stopwatch.Frequency / 1000;

    [Fact]
    public void A_fit_covers_every_quote_up_to_its_cause_once_and_the_cause_quote_alone_counts_for_the_cause_latency()
    {
        var tracker = new LatencyTracker(capacity: 5, firstMeasured: 0);
        var ids = Enumerable.Range(0, 5).Select(_ => Guid.NewGuid()).ToArray();
        for (var i = 0; i < 5; i++)
        {
            tracker.Published(ids[i], i, 1000 * Ms + i * Ms);
        }
        tracker.OnCurveFitted(ids[2], 1010 * Ms);
        tracker.OnCurveFitted(ids[2], 1011 * Ms); // a second curve of the same refit: not counted again
        tracker.OnCurveFitted(ids[4], 1020 * Ms);
        var cause = tracker.Curve.Summary();
        var every = tracker.AnyQuoteCurve.Summary();
        Assert.Equal(2, cause.Count);
        Assert.Equal(5, every.Count);
        // Quotes 0-2 (1000-1002 ms) are covered by the fit received at 1010 ms (10, 9, 8 ms); quotes 3-4 (1003, 1004 ms)
        // by the one at 1020 ms (17, 16 ms): the largest is 17 ms, and the cause latencies are 8 and 16 ms.
        Assert.Equal(17.0, every.MaxMs, 0.02);
        Assert.Equal(16.0, cause.MaxMs, 0.02);
        Assert.Equal(3, tracker.CurveEvents);
    }

    [Fact]
    public void Warm_up_quotes_and_unknown_causes_are_not_recorded()
    {
        var tracker = new LatencyTracker(capacity: 3, firstMeasured: 2);
        var ids = Enumerable.Range(0, 3).Select(_ => Guid.NewGuid()).ToArray();
        for (var i = 0; i < 3; i++)
        {
            tracker.Published(ids[i], i, i * Ms);
        }
        tracker.OnStatusChanged(ids[0], 5 * Ms);
        tracker.OnStatusChanged(Guid.NewGuid(), 5 * Ms);
        tracker.OnStatusChanged(null, 5 * Ms);
        tracker.OnStatusChanged(ids[2], 7 * Ms);
        tracker.OnCurveFitted(ids[2], 8 * Ms);
        Assert.Equal(1, tracker.Status.Summary().Count);
        Assert.Equal(5.0, tracker.Status.Summary().MaxMs, 0.01);
        Assert.Equal(1, tracker.AnyQuoteCurve.Summary().Count);
        Assert.Equal(4, tracker.StatusEvents);
    }

    [Fact]
    public void Book_updates_give_the_first_and_after_finish_the_last_per_cause()
    {
        var tracker = new LatencyTracker(capacity: 1, firstMeasured: 0);
        var id = Guid.NewGuid();
        tracker.Published(id, 0, 0);
        tracker.OnBookUpdated(id, 3 * Ms);
        tracker.OnBookUpdated(id, 6 * Ms);
        tracker.OnBookUpdated(id, 9 * Ms);
        tracker.Finish();
        Assert.Equal(3.0, tracker.BooksFirst.Summary().MaxMs, 0.01);
        Assert.Equal(9.0, tracker.BooksLast.Summary().MaxMs, 0.01);
        Assert.Equal(3, tracker.BookEvents);
    }
}
