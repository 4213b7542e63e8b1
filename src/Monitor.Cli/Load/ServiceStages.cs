using System.Diagnostics.Metrics;
using Monitor.Service.Telemetry;

namespace Monitor.Cli.Load;

/// <summary>
/// Listens to the in-process service's own duration histograms (meter <see cref="MonitorMetrics.MeterName"/>) while
/// <see cref="Measuring"/> is on, so a run shows where a quote's latency goes: the fit, the books, the exposure log,
/// the hand-off to the broker.
/// </summary>
internal sealed class ServiceStages : IDisposable
{
    private static readonly (string Instrument, string Name)[] Stages =
    [
        ("monitor.curve.fit.duration", "stage: curve fits per refit"),
        ("monitor.exposure.duration", "stage: books revalued + limits"),
        ("monitor.exposure_log.write.duration", "stage: exposure log write"),
        ("monitor.refit.duration", "stage: refit, lock held"),
        ("monitor.events.delay", "stage: outbox -> broker confirm"),
    ];

    private readonly MeterListener _listener = new();
    private readonly Dictionary<string, LatencyRecorder> _recorders;
    private volatile bool _measuring;

    public ServiceStages()
    {
        _recorders = Stages.ToDictionary(s => s.Instrument, s => new LatencyRecorder(s.Name), StringComparer.Ordinal);
        _listener.InstrumentPublished = (instrument, listener) =>
        {
            if (instrument.Meter.Name == MonitorMetrics.MeterName && _recorders.ContainsKey(instrument.Name))
            {
                listener.EnableMeasurementEvents(instrument, _recorders[instrument.Name]);
            }
        };
        _listener.SetMeasurementEventCallback<double>((_, milliseconds, _, state) =>
        {
            if (_measuring)
            {
                ((LatencyRecorder)state!).Record(TimeSpan.FromMilliseconds(milliseconds));
            }
        });
        _listener.Start();
    }

    /// <summary>Whether measurements are recorded now (on for the measured part of the paced phase only).</summary>
    public bool Measuring
    {
        get => _measuring;
        set => _measuring = value;
    }

    public IEnumerable<LatencySummary> Summaries() => Stages.Select(s => _recorders[s.Instrument].Summary());

    public void Dispose() => _listener.Dispose();
}
