using Monitor.Analytics.Market;
using Monitor.Analytics.Risk;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

/// <summary>
/// A quote stamped ahead of the business clock: refused beyond the tolerance (default 5 s), so one bad stamp never
/// outranks the good quotes after it. Today's build accepted a stamp up to 5 minutes ahead, and every later quote of
/// that bond was "older" and ignored until the clock passed the stamp.
/// </summary>
public sealed class QuoteClockTests
{
    private const string Bond = "VGB-2034-11";

    [Fact]
    public void A_quote_stamped_minutes_ahead_is_refused_and_the_good_quotes_after_it_refit_the_curve()
    {
        var engine = TestMarket.OpenedEngine();
        var government = engine.Curves[CurveKey.Government];
        var version = government.Version;
        var later = TestMarket.Now.AddMinutes(1);
        var good = TestMarket.Between(1, later);
        var bad = good.Single(q => q.InstrumentId == Bond);

        var ex = Assert.Throws<MessageRejectedException>(() =>
            engine.AcceptQuote(new BondQuote(Bond, later.AddMinutes(3), null, null, bad.Mid!.Value - 2, null, "skewed-feed"), later));
        Assert.Equal("quoteTime", ex.Field);
        Assert.Contains("is in the future", ex.Message, StringComparison.Ordinal);

        foreach (var quote in good)
        {
            engine.AcceptQuote(quote, later);
        }
        var result = engine.RefitDirtyCurves(later);

        Assert.True(Assert.Single(result.Curves, c => CurveKey.IsGovernment(c.CurveKey)).Accepted);
        Assert.Equal(version + 1, government.Version);
        Assert.Equal(later, government.LatestQuotes[Bond].Quote.QuoteTime);
        Assert.Equal(bad.Mid, government.LatestQuotes[Bond].Quote.Mid);
    }

    [Fact]
    public void A_stamp_within_the_tolerance_is_clock_skew_and_accepted()
    {
        var engine = TestMarket.OpenedEngine();
        var quote = TestMarket.Between(1, TestMarket.Now.AddSeconds(4)).Single(q => q.InstrumentId == Bond);

        engine.AcceptQuote(quote, TestMarket.Now);

        Assert.Equal(quote.QuoteTime, engine.Curves[CurveKey.Government].LatestQuotes[Bond].Quote.QuoteTime);
    }
}
