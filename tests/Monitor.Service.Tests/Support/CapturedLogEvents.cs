using System.Collections.Concurrent;
using Serilog.Core;
using Serilog.Events;

namespace Monitor.Service.Tests.Support;

/// <summary>A Serilog sink that keeps every event, to assert what the service logs.</summary>
public sealed class CapturedLogEvents : ILogEventSink
{
    private readonly ConcurrentQueue<LogEvent> _events = new();

    public IReadOnlyList<LogEvent> Events => _events.ToArray();

    public void Emit(LogEvent logEvent) => _events.Enqueue(logEvent);
}
