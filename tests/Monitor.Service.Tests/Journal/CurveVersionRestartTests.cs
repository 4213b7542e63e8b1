using MassTransit.Testing;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Curve versions only grow, across restarts: a consumer that orders fits by version must never take a new curve for an
/// old one. Today's build restarted every curve at v1. The restarted service continues from the exposure log's last
/// curve-fitted record of each curve (LoggedCurveVersions).
/// </summary>
public sealed class CurveVersionRestartTests
{
    [Fact]
    public async Task Versions_keep_growing_after_a_restart()
    {
        using var root = new TempFolder();
        Dictionary<string, long> last;
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            await ServiceUnderTest.WaitUntilAsync(() => first.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
            await first.QuoteAsync(TestMarket.Between(0.5, TestMarket.Now.AddMinutes(-10)));
            await first.Pipeline.WhenPublishedAsync();
            last = Newest(first);
            Assert.True(last[CurveKeyLabel.Government] >= 2);
        }

        await using var second = await ServiceUnderTest.StartAsync(root: root.Path);
        await ServiceUnderTest.WaitUntilAsync(() => second.Harness.Published.Select<CurveFitted>().Any(), "restart fits");
        await second.QuoteAsync(TestMarket.Between(0.8, TestMarket.Now.AddMinutes(-5)));
        await second.Pipeline.WhenPublishedAsync();

        var fits = second.Harness.Published.Select<CurveFitted>().Select(x => x.Context.Message).ToArray();
        Assert.Contains(fits, f => f.CurveId == CurveKeyLabel.Government);
        foreach (var fit in fits)
        {
            Assert.True(fit.Version > last.GetValueOrDefault(fit.CurveId),
                $"{fit.CurveId} v{fit.Version} after the restart is not above v{last.GetValueOrDefault(fit.CurveId)} before it");
        }
        Assert.All(second.Harness.Published.Select<CurveRejected>().Select(x => x.Context.Message),
            r => Assert.Null(r.KeptCurveVersion)); // UTIL-A never fitted: no kept curve, whatever its version floor
    }

    private static Dictionary<string, long> Newest(ServiceUnderTest service) =>
        service.Harness.Published.Select<CurveFitted>().Select(x => x.Context.Message)
            .GroupBy(f => f.CurveId).ToDictionary(g => g.Key, g => g.Max(f => f.Version));
}
