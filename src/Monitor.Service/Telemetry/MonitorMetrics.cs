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
        StatusChanges = _meter.CreateCounter<long>("monitor.limit.status.changes", unit: "{event}", description: "Limit status changes published.");
    }

    public Counter<long> MessagesConsumed { get; }

    public Counter<long> MessagesRejected { get; }

    public Histogram<double> FitDuration { get; }

    public Histogram<double> ExposureDuration { get; }

    public Histogram<double> QueueLag { get; }

    public Counter<long> StatusChanges { get; }

    public void Dispose() => _meter.Dispose();
}
