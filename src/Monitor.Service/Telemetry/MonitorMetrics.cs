using System.Diagnostics.Metrics;

namespace Monitor.Service.Telemetry;

/// <summary>
/// The service's instruments (System.Diagnostics.Metrics, meter "Monitor"): any OpenTelemetry or
/// dotnet-counters listener can read them. Names are our own.
/// </summary>
public sealed class MonitorMetrics : IDisposable
{
    public const string MeterName = "Monitor";

    private readonly Meter _meter;

    public MonitorMetrics(IMeterFactory meterFactory)
    {
        ArgumentNullException.ThrowIfNull(meterFactory);
        _meter = meterFactory.Create(MeterName);
        MessagesConsumed = _meter.CreateCounter<long>("monitor.messages.consumed", unit: "{message}", description: "Messages consumed, by type.");
        MessagesRejected = _meter.CreateCounter<long>("monitor.messages.rejected", unit: "{message}", description: "Messages refused and sent to an error queue, by type.");
        FitDuration = _meter.CreateHistogram<double>("monitor.curve.fit.duration", unit: "ms", description: "Time to refit one curve.");
        ExposureDuration = _meter.CreateHistogram<double>("monitor.exposure.duration", unit: "ms", description: "Time to recompute the books after a change.");
        QueueLag = _meter.CreateHistogram<double>("monitor.queue.lag", unit: "ms", description: "Processing time minus the message's event time.");
        RefitDuration = _meter.CreateHistogram<double>("monitor.refit.duration", unit: "ms", description: "Time a refit holds the pipeline: fits, revaluation, limits, exposure log, hand-off to the outbox.");
        LogWriteDuration = _meter.CreateHistogram<double>("monitor.exposure_log.write.duration", unit: "ms", description: "Time to write one change's records to the exposure log, flush to disk included.");
        EventDelay = _meter.CreateHistogram<double>("monitor.events.delay", unit: "ms", description: "Time from a change's hand-off to the outbox until the broker confirmed all its events.");
        StatusChanges = _meter.CreateCounter<long>("monitor.limit.status.changes", unit: "{event}", description: "Limit status changes published.");
        StorageWriteFailures = _meter.CreateCounter<long>("monitor.storage.write.failures", unit: "{attempt}", description: "Durable writes that failed for a storage reason and are retried, by store.");
        StoresFailing = _meter.CreateUpDownCounter<int>("monitor.storage.failing", unit: "{store}", description: "Stores (exposure log, trade journal) whose writes are failing now; the pipeline stalls while above 0.");
    }

    public Counter<long> MessagesConsumed { get; }

    public Counter<long> MessagesRejected { get; }

    public Histogram<double> FitDuration { get; }

    public Histogram<double> ExposureDuration { get; }

    public Histogram<double> QueueLag { get; }

    public Histogram<double> RefitDuration { get; }

    public Histogram<double> LogWriteDuration { get; }

    public Histogram<double> EventDelay { get; }

    public Counter<long> StatusChanges { get; }

    public Counter<long> StorageWriteFailures { get; }

    public UpDownCounter<int> StoresFailing { get; }

    public void Dispose() => _meter.Dispose();
}
