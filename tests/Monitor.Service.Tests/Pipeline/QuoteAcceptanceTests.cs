using Monitor.Contracts.V1;
using Monitor.Analytics.Risk;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>Quotes are checked, priced and acknowledged without the engine's lock, and the next refit takes them.</summary>
public sealed class QuoteAcceptanceTests
{
    [Fact]
    public async Task A_quote_is_consumed_while_the_engine_is_busy_and_the_next_refit_fits_it()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var versionBefore = await service.Pipeline.ReadAsync(e => e.Curves[CurveKey.Government].Version);
        var quotes = TestMarket.Shifted(TestMarket.OpenQuotes().Where(q => q.InstrumentId.StartsWith("VGB", StringComparison.Ordinal)).ToArray(), 0.25, TestMarket.Now.AddMinutes(-1));

        using var release = new ManualResetEventSlim();
        using var holding = new ManualResetEventSlim();
        // Holds the engine's lock the way a long refit would.
        var busy = Task.Run(() => service.Pipeline.ReadAsync(_ =>
        {
            holding.Set();
            release.Wait(TimeSpan.FromSeconds(30));
            return 0;
        }));
        Assert.True(holding.Wait(TimeSpan.FromSeconds(10)));
        var consumedBefore = service.Harness.Consumed.Select<BondQuoted>().Count();
        foreach (var quote in quotes)
        {
            await service.Harness.Bus.Publish(ServiceUnderTest.ToMessage(quote));
        }
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Consumed.Select<BondQuoted>().Count() >= consumedBefore + quotes.Count, "quotes consumed while the lock is held");
        Assert.False(busy.IsCompleted); // the lock was held the whole time
        release.Set();
        await busy;

        await service.RefitAsync();

        var government = await service.Pipeline.ReadAsync(e => e.Curves[CurveKey.Government]);
        Assert.Equal(versionBefore + 1, government.Version); // one refit took the whole burst
        Assert.All(quotes, q => Assert.Equal(q.QuoteTime, government.LatestQuotes[q.InstrumentId].Quote.QuoteTime));
    }
}
