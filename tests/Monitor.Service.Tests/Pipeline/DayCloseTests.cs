using System.Collections.Concurrent;
using System.Text.Json;
using Microsoft.Extensions.DependencyInjection;
using Monitor.Service.Audit;
using Monitor.Service.Pipeline;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// Issue 10, "Business days": the roll passing while the service runs closes the day (close snapshots, one
/// day-closed record, the listeners told its seq and hash); a stop at any time writes a stop record, never a day's end.
/// </summary>
public class DayCloseTests
{
    [Fact]
    public async Task The_roll_passing_closes_the_day_and_tells_the_listeners()
    {
        using var root = new TempFolder();
        var listener = new RecordingListener();
        await using (var service = await ServiceUnderTest.StartAsync(root: root.Path, services: s => s.AddSingleton<IDayCloseListener>(listener)))
        {
            var valued = await service.Pipeline.ReadAsync(e => e.Books.Values.Count(b => b.Exposures is not null));
            Assert.True(valued > 0, "the opening fit values the books");
            Assert.Empty(ServiceUnderTest.LogLines(service.LogFolder, ExposureLogKinds.DayClosed));

            service.Time.Advance(TimeSpan.FromHours(7)); // 17:00Z -> 00:00Z: the default roll, midnight UTC
            await ServiceUnderTest.WaitUntilAsync(() => !listener.Closes.IsEmpty, "day closed");

            var close = Assert.Single(listener.Closes);
            Assert.Equal(new DateOnly(2026, 6, 1), close.BusinessDate);
            Assert.Equal(new DateTimeOffset(2026, 6, 2, 0, 0, 0, TimeSpan.Zero), close.ClosedAt);
            var closed = JsonDocument.Parse(Assert.Single(ServiceUnderTest.LogLines(service.LogFolder, ExposureLogKinds.DayClosed))).RootElement;
            Assert.Equal(close.LogSeq, closed.GetProperty("seq").GetInt64());
            Assert.Equal(close.LogMac, closed.GetProperty("mac").GetString());
            Assert.Equal("2026-06-01", closed.GetProperty("payload").GetProperty("businessDate").GetString());
            Assert.Equal(valued, ServiceUnderTest.LogLines(service.LogFolder, ExposureLogKinds.CloseSnapshot).Count);
            Assert.Equal(valued, close.Books);
            Assert.Empty(ServiceUnderTest.LogLines(service.LogFolder, ExposureLogKinds.ServiceStopped));
        }
        Assert.Single(ServiceUnderTest.LogLines(Path.Combine(root.Path, "exposure-log"), ExposureLogKinds.ServiceStopped));
        Assert.Single(listener.Closes);
    }

    [Fact]
    public async Task An_intraday_stop_writes_a_stop_record_not_a_day_end()
    {
        using var root = new TempFolder();
        int valued;
        await using (var service = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            valued = await service.Pipeline.ReadAsync(e => e.Books.Values.Count(b => b.Exposures is not null));
        }

        var log = Path.Combine(root.Path, "exposure-log");
        var stopped = JsonDocument.Parse(Assert.Single(ServiceUnderTest.LogLines(log, ExposureLogKinds.ServiceStopped))).RootElement;
        Assert.Equal("2026-06-01", stopped.GetProperty("payload").GetProperty("businessDate").GetString());
        Assert.Equal(valued, ServiceUnderTest.LogLines(log, ExposureLogKinds.StopSnapshot).Count);
        Assert.Empty(ServiceUnderTest.LogLines(log, "day-end"));
        Assert.Empty(ServiceUnderTest.LogLines(log, ExposureLogKinds.DayClosed));
        Assert.Empty(ServiceUnderTest.LogLines(log, ExposureLogKinds.CloseSnapshot));
    }

    private sealed class RecordingListener : IDayCloseListener
    {
        public ConcurrentQueue<DayClose> Closes { get; } = new();

        public Task OnDayClosedAsync(DayClose close, CancellationToken cancellationToken)
        {
            Closes.Enqueue(close);
            return Task.CompletedTask;
        }
    }
}
