using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Pricing;
using Monitor.Analytics.Risk;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

/// <summary>
/// No book left out: a book holding a spread group without a fitted curve (UTIL-A has three quotes, its gate asks for
/// four) is valued on the government curve plus a flat spread from each bond's own price, its figures marked
/// provisional with the bond named, and its desk and the firm are judged with it.
/// </summary>
public sealed class RiskEngineProvisionalTests
{
    private static readonly string[] UtilA = ["QFU-2029-03", "QFU-2033-09", "SRT-2031-06"];

    [Fact]
    public void A_book_on_a_group_without_a_curve_is_valued_provisionally_and_counted_in_its_desk_and_the_firm()
    {
        var engine = TestMarket.OpenedEngine();
        Assert.Null(engine.Curves["UTIL-A"].Curve);

        var book = engine.Books["CREDIT-IG"];

        // Valued, not left out: figures exist, are marked, and name every UTIL-A bond and its quote.
        Assert.NotNull(book.Exposures);
        Assert.Equal(3, book.ProvisionalReasons.Count);
        foreach (var id in UtilA)
        {
            Assert.Contains(book.ProvisionalReasons, r => r.Contains(id, StringComparison.Ordinal) && r.Contains("flat spread from its quote", StringComparison.Ordinal));
        }
        Assert.Empty(engine.Books["RATES-CORE"].ProvisionalReasons);
        Assert.True(book.Exposures!.BySpreadGroup["UTIL-A"][ExposureMeasure.SpreadLevel] > 0); // long credit loses when its spread rises

        // The flat spread reprices each quote: the UTIL-A value is the quotes' dirty value (definition of the z-spread,
        // Fabozzi, Fixed Income Analysis, ch. 6); 1e-4 relative allows the settlement lag between quote and valuation date.
        var expected = 0.0;
        foreach (var id in UtilA)
        {
            var quote = engine.Curves["UTIL-A"].LatestQuotes[id];
            expected += book.Positions[id] * quote.DirtyPrice / 100.0;
        }
        var utilValue = book.Exposures.BySpreadGroup["UTIL-A"][ExposureMeasure.MarketValue];
        Assert.Equal(expected, utilValue, expected * 1e-4);

        // The firm's value is every book's, the provisional one included (common practice, no source: a sum over books).
        var firm = Assert.Single(engine.Limits.CurrentUse(TestMarket.Now), u => u.Limit.Id == "firm-value");
        var sum = engine.Books.Values.Sum(b => b.Exposures!.Totals[ExposureMeasure.MarketValue]);
        Assert.Equal(sum, firm.Exposure, Math.Abs(sum) * 1e-12);
        var desk = Assert.Single(engine.Limits.CurrentUse(TestMarket.Now), u => u.Limit.Id == "credit-spread-level");
        Assert.Equal(book.Exposures.Totals[ExposureMeasure.SpreadLevel], desk.Exposure);
        Assert.NotEqual(0.0, desk.Exposure);

        // A limit judged on these figures says so, naming the book and the bond.
        Assert.Contains(engine.ProvisionalReasons(LimitScope.Desk("credit")), r => r.StartsWith("book CREDIT-IG: ", StringComparison.Ordinal) && r.Contains("QFU-2029-03", StringComparison.Ordinal));
        Assert.NotEmpty(engine.ProvisionalReasons(LimitScope.Firm("test-firm")));
        Assert.Empty(engine.ProvisionalReasons(LimitScope.Desk("rates")));
        Assert.Empty(engine.ProvisionalReasons(LimitScope.Book("RATES-CORE")));
    }

    [Fact]
    public void A_bond_with_no_quote_is_valued_on_its_last_trade_price_and_one_with_no_price_is_still_valued_and_named()
    {
        var engine = TestMarket.OpenedEngine();
        engine.DefineInstrument(Bond("NEW-2031-06", "NEW-GROUP", 0.05m, new DateOnly(2031, 6, 1)));
        engine.DefineInstrument(Bond("BARE-2032-06", "BARE-GROUP", 0.05m, new DateOnly(2032, 6, 1)));

        var traded = engine.ApplyTrade(new TradeInput("T-1", 1, TradeAction.New, "RATES-CORE", "NEW-2031-06", 2_000_000, 97.5, TestMarket.Now), TestMarket.Now);
        var update = Assert.Single(traded.Books);
        var reason = Assert.Single(update.ProvisionalReasons);
        Assert.Contains("NEW-2031-06", reason, StringComparison.Ordinal);
        Assert.Contains("last trade price 97.5", reason, StringComparison.Ordinal);
        // Valued at its trade price: the flat spread reprices it (z-spread definition, Fabozzi ch. 6); 1e-4 as above.
        var newValue = update.Exposures.BySpreadGroup["NEW-GROUP"][ExposureMeasure.MarketValue];
        var accrued = BondYield.Measures(engine.Instruments["NEW-2031-06"], TestMarket.ValuationDate,
            BondYield.FromCleanPrice(engine.Instruments["NEW-2031-06"], TestMarket.ValuationDate, 97.5)).AccruedInterest;
        Assert.Equal(2_000_000 * (97.5 + accrued) / 100, newValue, newValue * 1e-4);

        engine.LoadPosition("RATES-CORE", "BARE-2032-06", 1_000_000);
        var all = engine.RevalueAll(TestMarket.Now);
        var core = Assert.Single(all.Books, b => b.Book == "RATES-CORE");
        Assert.Contains(core.ProvisionalReasons, r => r.Contains("BARE-2032-06", StringComparison.Ordinal) && r.Contains("no quote or trade price", StringComparison.Ordinal));
        Assert.True(core.Exposures.BySpreadGroup["BARE-GROUP"][ExposureMeasure.MarketValue] > 0); // never zeroed
        Assert.Contains("RATES-CORE", all.BooksAwaitingCurves);
    }

    [Fact]
    public void Books_leave_provisional_figures_when_their_spread_curve_fits()
    {
        var engine = TestMarket.Engine();
        foreach (var quote in TestMarket.OpenQuotes().Where(q => !q.InstrumentId.StartsWith("BHS", StringComparison.Ordinal) && !q.InstrumentId.StartsWith("KWS", StringComparison.Ordinal)))
        {
            engine.AcceptQuote(quote, TestMarket.Now);
        }
        engine.RefitDirtyCurves(TestMarket.Now);
        Assert.Contains(engine.Books["CREDIT-IG"].ProvisionalReasons, r => r.Contains("BHS-2032-06", StringComparison.Ordinal) && r.Contains("no quote or trade price", StringComparison.Ordinal));

        foreach (var quote in TestMarket.OpenQuotes().Where(q => q.InstrumentId.StartsWith("BHS", StringComparison.Ordinal) || q.InstrumentId.StartsWith("KWS", StringComparison.Ordinal)))
        {
            engine.AcceptQuote(quote, TestMarket.Now);
        }
        var refit = engine.RefitDirtyCurves(TestMarket.Now);

        Assert.True(Assert.Single(refit.Curves, c => c.CurveKey == "INDUSTRIAL-BBB").Accepted);
        var reasons = engine.Books["CREDIT-IG"].ProvisionalReasons;
        Assert.DoesNotContain(reasons, r => r.Contains("INDUSTRIAL-BBB", StringComparison.Ordinal));
        Assert.All(reasons, r => Assert.Contains("UTIL-A", r, StringComparison.Ordinal)); // still no UTIL-A curve
    }

    private static Bond Bond(string id, string group, decimal coupon, DateOnly maturity) =>
        new(id, "Veloria Test Issuer", group, "XTS", coupon, 2, DayCounters.Parse("ACT/ACT-ICMA"), new DateOnly(2024, 6, 1), null, maturity, 100m, 1);
}
