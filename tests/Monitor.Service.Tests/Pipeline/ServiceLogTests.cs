using Microsoft.Extensions.DependencyInjection;
using Monitor.Contracts.V1;
using Monitor.Service.Tests.Support;
using Serilog;
using Serilog.Events;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>Issue 11: a limit status change is also a structured line of the service log, and the stop is logged.</summary>
public sealed class ServiceLogTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task A_breach_is_a_warning_line_with_the_event_properties_and_the_stop_is_logged()
    {
        // A DV01 bound of 1 (money per bp) that the RATES-CURVE book's opening positions exceed: the opening fit breaches it.
        var limits = TestMarket.WriteLimits(_folder.Path,
            "{ \"id\": \"t-tiny-dv01\", \"scope\": \"book\", \"scopeId\": \"RATES-CURVE\", \"measure\": \"dv01\", \"upper\": 1 }");
        var captured = new CapturedLogEvents();
        LimitStatusChanged breach;
        await using (var service = await ServiceUnderTest.StartAsync(limits, logging: s => s.AddSerilog(
            new LoggerConfiguration().MinimumLevel.Information().WriteTo.Sink(captured).CreateLogger(), dispose: true)))
        {
            await service.RefitAsync();
            breach = service.Harness.Published.Select<LimitStatusChanged>().Select(x => x.Context.Message).First(m => m.LimitId == "t-tiny-dv01");
        }

        var line = Assert.Single(captured.Events, e => e.Properties.TryGetValue("LimitId", out var id) && id.ToString() == "\"t-tiny-dv01\"");
        Assert.Equal(LogEventLevel.Warning, line.Level);
        Assert.Equal(breach.Scope, Scalar(line, "Scope"));
        Assert.Equal(breach.ScopeId, Scalar(line, "ScopeId"));
        Assert.Equal(breach.Measure, Scalar(line, "Measure"));
        Assert.Equal("breach", Scalar(line, "Status"));
        Assert.Equal(breach.PreviousStatus, Scalar(line, "PreviousStatus"));
        Assert.Equal(breach.Exposure, (double)Scalar(line, "Value")!);
        Assert.Equal(1.0, (double)Scalar(line, "Bound")!);
        Assert.Contains(captured.Events, e => e.MessageTemplate.Text.StartsWith("Monitor stopping", StringComparison.Ordinal));
    }

    private static object? Scalar(LogEvent e, string name) => ((ScalarValue)e.Properties[name]).Value;
}
