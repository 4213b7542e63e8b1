using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Time.Testing;
using Monitor.Analytics.Risk;
using Monitor.Contracts.V1;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>The outbox: order across changes, conflation of book figures, retry through a broker outage.</summary>
public sealed class EventOutboxTests
{
    private static readonly DateTimeOffset Now = TestMarket.Now;

    [Fact]
    public async Task ChangesArePublishedInTheOrderTheyWereQueued()
    {
        var (bus, recorder) = RecordingBus.Create();
        await using var run = await Running(bus, TimeSpan.Zero, new FakeTimeProvider(Now));
        for (var i = 0; i < 200; i++)
        {
            await run.Outbox.EnqueueAsync([Status(i)], [], CancellationToken.None);
        }
        await run.Outbox.WhenPublishedAsync(CancellationToken.None);

        var sequence = recorder.Published.Cast<LimitStatusChanged>().Select(s => (int)s.Exposure).ToArray();
        Assert.Equal(Enumerable.Range(0, 200), sequence);
    }

    [Fact]
    public async Task BookFiguresWithinTheIntervalGoOutOncePerBookNewestFirstWinsWhileLimitEventsGoAtOnce()
    {
        var (bus, recorder) = RecordingBus.Create();
        var time = new FakeTimeProvider(Now);
        await using var run = await Running(bus, TimeSpan.FromSeconds(1), time);

        await run.Outbox.EnqueueAsync([Status(1)], [Book("B1", 10), Book("B2", 20)], CancellationToken.None);
        await run.Outbox.EnqueueAsync([Status(2)], [Book("B1", 11)], CancellationToken.None);
        await ServiceUnderTest.WaitUntilAsync(() => recorder.Published.Count >= 2, "limit events published");
        Assert.All(recorder.Published, m => Assert.IsType<LimitStatusChanged>(m)); // the books wait for the interval

        time.Advance(TimeSpan.FromSeconds(1));
        await ServiceUnderTest.WaitUntilAsync(() => recorder.Published.Count >= 3, "book figures published");
        await run.Outbox.WhenPublishedAsync(CancellationToken.None);

        var batch = Assert.Single(recorder.Published.OfType<BookExposuresBatch>()); // both books in one message
        Assert.Equal(["B1", "B2"], batch.Books.Select(b => b.Book));
        Assert.Equal(11, batch.Books[0].Measures["marketValue"]); // the newer of B1's two figures
        Assert.Equal(20, batch.Books[1].Measures["marketValue"]);
    }

    [Fact]
    public async Task ManyBooksGoOutInBatchesOfAtMostTheBatchSizeInBookOrderEachBookOnce()
    {
        var (bus, recorder) = RecordingBus.Create();
        var time = new FakeTimeProvider(Now);
        await using var run = await Running(bus, TimeSpan.FromSeconds(1), time);
        var count = 2 * EventOutbox.BookBatchSize + 17;
        // Queued in reverse order over two changes; the second change moves every book again.
        var ids = Enumerable.Range(0, count).Select(i => $"B{i:D4}").Reverse().ToArray();
        await run.Outbox.EnqueueAsync([], [.. ids.Select(id => Book(id, 1))], CancellationToken.None);
        await run.Outbox.EnqueueAsync([], [.. ids.Select(id => Book(id, 2))], CancellationToken.None);

        // Ticked until sent: the outbox's timer may start after the first tick (nothing else to wait for here).
        await ServiceUnderTest.WaitUntilAsync(() =>
        {
            time.Advance(TimeSpan.FromSeconds(1));
            return recorder.Published.Count >= 3;
        }, "book batches published");
        await run.Outbox.WhenPublishedAsync(CancellationToken.None);

        var batches = recorder.Published.Cast<BookExposuresBatch>().ToArray();
        Assert.Equal([EventOutbox.BookBatchSize, EventOutbox.BookBatchSize, 17], batches.Select(b => b.Books.Count));
        var sent = batches.SelectMany(b => b.Books).ToArray();
        Assert.Equal(ids.Order(StringComparer.Ordinal), sent.Select(b => b.Book));
        Assert.All(sent, b => Assert.Equal(2, b.Measures["marketValue"]));
    }

    [Fact]
    public async Task WithoutAnIntervalEachChangesBooksFollowItsLimitEventsAsABatch()
    {
        var (bus, recorder) = RecordingBus.Create();
        await using var run = await Running(bus, TimeSpan.Zero, new FakeTimeProvider(Now));

        await run.Outbox.EnqueueAsync([Status(1)], [Book("B2", 20), Book("B1", 10)], CancellationToken.None);
        await run.Outbox.EnqueueAsync([Status(2)], [Book("B1", 11)], CancellationToken.None);
        await run.Outbox.WhenPublishedAsync(CancellationToken.None);

        Assert.Equal([typeof(LimitStatusChanged), typeof(BookExposuresBatch), typeof(LimitStatusChanged), typeof(BookExposuresBatch)],
            recorder.Published.Select(m => m.GetType()));
        var batches = recorder.Published.OfType<BookExposuresBatch>().ToArray();
        Assert.Equal(["B1", "B2"], batches[0].Books.Select(b => b.Book));
        Assert.Equal(11, Assert.Single(batches[1].Books).Measures["marketValue"]);
    }

    [Fact]
    public async Task ABrokerOutageIsRetriedUntilEverythingIsPublishedAndHealthFollowsIt()
    {
        var (bus, recorder) = RecordingBus.Create();
        var time = new FakeTimeProvider(Now);
        await using var run = await Running(bus, TimeSpan.Zero, time);
        var health = new EventOutboxHealthCheck(run.Outbox);

        recorder.Failing = true;
        await run.Outbox.EnqueueAsync([Status(1), Status(2)], [], CancellationToken.None);
        await run.Outbox.EnqueueAsync([Status(3)], [], CancellationToken.None);
        await ServiceUnderTest.WaitUntilAsync(() => run.Outbox.LastError is not null, "publish failure seen");
        Assert.Equal(HealthStatus.Unhealthy, (await health.CheckHealthAsync(new HealthCheckContext())).Status);
        Assert.Equal(2, run.Outbox.Backlog);
        Assert.Empty(recorder.Published);

        recorder.Failing = false;
        // The retry waits on the outbox's clock; advance it until the queue is through.
        await ServiceUnderTest.WaitUntilAsync(() =>
        {
            time.Advance(TimeSpan.FromSeconds(1));
            return run.Outbox.Backlog == 0;
        }, "outbox drained after the outage");

        Assert.Equal([1, 2, 3], recorder.Published.Cast<LimitStatusChanged>().Select(s => (int)s.Exposure).Order());
        Assert.Equal(3, recorder.Published.Count); // nothing published twice
        Assert.Equal(HealthStatus.Healthy, (await health.CheckHealthAsync(new HealthCheckContext())).Status);
    }

    private static readonly MonitorMetrics Metrics =
        new(new ServiceCollection().AddMetrics().BuildServiceProvider().GetRequiredService<System.Diagnostics.Metrics.IMeterFactory>());

    private static async Task<RunningOutbox> Running(MassTransit.IBus bus, TimeSpan bookInterval, TimeProvider time)
    {
        var options = Options.Create(new MonitorOptions { BookEventInterval = bookInterval });
        var outbox = new EventOutbox(bus, options, Metrics, time, NullLogger<EventOutbox>.Instance);
        await outbox.StartAsync(CancellationToken.None);
        return new RunningOutbox(outbox);
    }

    private static LimitStatusChanged Status(int sequence) => new()
    {
        LimitId = "L" + sequence,
        Scope = "book",
        ScopeId = "B1",
        Measure = "dv01",
        Status = "warning",
        PreviousStatus = "within",
        Exposure = sequence,
        Limit = 100,
        Utilisation = 0.9,
        Curves = [],
        CauseMessageType = "test",
        EventTime = Now,
        ProcessedAt = Now,
    };

    private static BookFigures Book(string book, double value) => new(
        new BookUpdate(book, BookExposures.FromTotals(new Dictionary<ExposureMeasure, double> { [ExposureMeasure.MarketValue] = value }),
            new BookRisk(FactorExposures.Zero(3, 3), new Dictionary<string, FactorExposures>())),
        [],
        Cause.Internal("test", Now),
        Now);

    private sealed class RunningOutbox(EventOutbox outbox) : IAsyncDisposable
    {
        public EventOutbox Outbox { get; } = outbox;

        public async ValueTask DisposeAsync()
        {
            using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(5));
            await Outbox.StopAsync(stop.Token);
            Outbox.Dispose();
        }
    }
}
