using System.Text.Json;
using MassTransit;
using MassTransit.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Monitor.Contracts.V1;
using Monitor.Service.Audit;
using Monitor.Service.Hosting;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// Issue 10, "Durable outbox": every event with a log record has a stable id (the MessageId) derived from that record,
/// and events whose records are in the log but which the broker never confirmed are published again at the next start,
/// with the same ids; confirmed ones are not.
/// </summary>
public class DurableOutboxTests
{
    private static readonly string[] EventKinds = [ExposureLogKinds.CurveFitted, ExposureLogKinds.CurveRejected, ExposureLogKinds.StatusChange];

    [Fact]
    public async Task Events_waiting_at_a_kill_are_published_at_the_next_start_with_the_same_ids()
    {
        using var root = new TempFolder();
        var (bus, recorder) = RecordingBus.Create();
        recorder.Failing = true; // the broker confirms nothing before the kill
        var first = await ServiceUnderTest.StartAsync(root: root.Path, services: s => s.AddSingleton(sp => new EventOutbox(
            bus, sp.GetRequiredService<IOptions<MonitorOptions>>(), sp.GetRequiredService<MonitorMetrics>(), sp.GetRequiredService<TimeProvider>(),
            NullLogger<EventOutbox>.Instance, sp.GetRequiredService<OutboxFile>())));
        try
        {
            // Not TradeAsync: it waits for the events to go out, and here they cannot.
            await first.Harness.Bus.Publish(ServiceUnderTest.Trade("K-1", 1, "new", "RATES-CORE", "VGB-2031-05", 60_000_000));
            await ServiceUnderTest.WaitUntilAsync(() => first.Harness.Consumed.Select<TradeBooked>().Any(), "trade consumed");
            await ServiceUnderTest.WaitUntilAsync(() => ServiceUnderTest.LogLines(first.LogFolder, ExposureLogKinds.TradeApplied).Count > 0, "trade logged");
            var expected = EventIds(first.LogFolder);
            Assert.NotEmpty(expected);
            Assert.Empty(recorder.Published);
            // Killed: the first process never stops and its outbox never drains; the operating system frees its folder locks.
            first.Services.GetRequiredService<Monitor.Service.Storage.WriterLocks>().Dispose();

            await using var second = await ServiceUnderTest.StartAsync(root: root.Path);
            await ServiceUnderTest.WaitUntilAsync(() => expected.Keys.All(PublishedIds(second).Contains), "the waiting events published again");
            await second.Pipeline.WhenPublishedAsync();

            // The same ids, on messages equal to what the first run meant to send (each record's figures).
            var published = PublishedMessages(second);
            foreach (var (id, kind) in expected)
            {
                var message = published[id];
                Assert.Equal(kind == ExposureLogKinds.StatusChange ? typeof(LimitStatusChanged) : kind == ExposureLogKinds.CurveFitted ? typeof(CurveFitted) : typeof(CurveRejected), message.GetType());
            }
            Assert.Equal(expected.Count, expected.Keys.Count(published.ContainsKey));
        }
        finally
        {
            recorder.Failing = false;
            first.Time.Advance(TimeSpan.FromMinutes(1));
            await first.DisposeAsync();
        }
    }

    [Fact]
    public async Task Confirmed_events_are_not_published_again()
    {
        using var root = new TempFolder();
        Dictionary<Guid, string> sent;
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            await first.TradeAsync(ServiceUnderTest.Trade("C-1", 1, "new", "RATES-CORE", "VGB-2031-05", 60_000_000));
            await first.Pipeline.WhenPublishedAsync();
            sent = EventIds(first.LogFolder);
            Assert.Equal(sent.Keys.Order(), PublishedIds(first).Where(sent.ContainsKey).Order());
        }

        await using var second = await ServiceUnderTest.StartAsync(root: root.Path);
        await second.Pipeline.WhenPublishedAsync();
        Assert.DoesNotContain(PublishedIds(second), sent.ContainsKey);
    }

    /// <summary>The stable id and kind of every event-bearing record in the log.</summary>
    private static Dictionary<Guid, string> EventIds(string logFolder) =>
        ServiceUnderTest.LogLines(logFolder)
            .Select(l => JsonDocument.Parse(l).RootElement)
            .Where(r => EventKinds.Contains(r.GetProperty("kind").GetString()))
            .ToDictionary(r => OutboxEntry.IdOf(r.GetProperty("seq").GetInt64(), r.GetProperty("mac").GetString()!), r => r.GetProperty("kind").GetString()!);

    private static HashSet<Guid> PublishedIds(ServiceUnderTest service) => [.. PublishedMessages(service).Keys];

    private static Dictionary<Guid, object> PublishedMessages(ServiceUnderTest service)
    {
        var all = new Dictionary<Guid, object>();
        foreach (var p in service.Harness.Published.Select(_ => true))
        {
            if (p.Context.MessageId is { } id && p.MessageObject is LimitStatusChanged or CurveFitted or CurveRejected)
            {
                all[id] = p.MessageObject;
            }
        }
        return all;
    }
}
