using Monitor.Analytics.Market;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

/// <summary>Bad input (issue 5): refused with the field and the value named, and no state change.</summary>
public sealed class RiskEngineRejectionTests
{
    private static TradeInput Trade(string book = "RATES-CORE", string instrument = "VGB-2034-11", double face = 1_000_000, double price = 100) =>
        new("T-1", 1, TradeAction.New, book, instrument, face, price, TestMarket.Now);

    public static TheoryData<string, string, string, double, double> BadTrades() => new()
    {
        { "NO-SUCH-BOOK", "VGB-2034-11", "book", 1_000_000, 100 },
        { "RATES-CORE", "XX-0000", "instrumentId", 1_000_000, 100 },
        { "RATES-CORE", "VGB-2034-11", "cleanPrice", 1_000_000, double.NaN },
        { "RATES-CORE", "VGB-2034-11", "cleanPrice", 1_000_000, -3 },
        { "RATES-CORE", "VGB-2034-11", "cleanPrice", 1_000_000, 0 },
        { "RATES-CORE", "VGB-2034-11", "cleanPrice", 1_000_000, 1e9 },
        { "RATES-CORE", "VGB-2034-11", "faceAmount", double.PositiveInfinity, 100 },
        { "RATES-CORE", "VGB-2034-11", "faceAmount", 0, 100 },
        { "RATES-CORE", "VGB-2034-11", "faceAmount", 1e15, 100 },
    };

    [Theory]
    [MemberData(nameof(BadTrades))]
    public void Bad_trades_are_rejected_naming_the_field_and_leave_state_unchanged(string book, string instrument, string field, double face, double price)
    {
        var engine = TestMarket.OpenedEngine();
        var before = EngineState.Of(engine);
        var ex = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(Trade(book, instrument, face, price), TestMarket.Now));
        Assert.Equal(field, ex.Field);
        Assert.StartsWith(field + ":", ex.Message, StringComparison.Ordinal);
        Assert.NotNull(ex.Value);
        Assert.Contains(ex.Value, ex.Message, StringComparison.Ordinal);
        Assert.Equal(before, EngineState.Of(engine));
    }

    [Theory]
    [InlineData(-30)]
    [InlineData(30)]
    public void A_trade_time_weeks_from_the_valuation_date_is_rejected(int days)
    {
        var engine = TestMarket.OpenedEngine();
        var before = EngineState.Of(engine);
        var trade = Trade() with { TradeTime = TestMarket.Now.AddDays(days) };
        var ex = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(trade, TestMarket.Now));
        Assert.Equal("tradeTime", ex.Field);
        Assert.Equal(before, EngineState.Of(engine));
    }

    [Fact]
    public void Oversized_ids_are_refused_by_the_inbound_mapper_naming_the_field()
    {
        var message = ServiceUnderTest.Trade(new string('T', 10_000), 1, "new", "RATES-CORE", "VGB-2034-11", 1_000_000);
        var ex = Assert.Throws<MessageRejectedException>(() => Monitor.Service.Consumers.InboundMapper.ToTrade(message));
        Assert.Equal("tradeId", ex.Field);
        Assert.Contains("10000 characters", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_trade_in_a_matured_bond_is_rejected()
    {
        var engine = TestMarket.OpenedEngine();
        engine.DefineInstrument(new Monitor.Analytics.Instruments.Bond("VGB-2026-05", "Republic of Veloria", null, "XTS", 0.015m, 2,
            Monitor.Analytics.Dates.DayCounters.Parse("ACT/ACT-ICMA"), new DateOnly(2023, 5, 15), null, new DateOnly(2026, 5, 15), 100m, 1));
        var before = EngineState.Of(engine);
        var ex = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(Trade(instrument: "VGB-2026-05"), TestMarket.Now));
        Assert.Equal("instrumentId", ex.Field);
        Assert.Contains("matured", ex.Message, StringComparison.Ordinal);
        var quote = Assert.Throws<MessageRejectedException>(() => engine.AcceptQuote(new BondQuote("VGB-2026-05", TestMarket.Now, null, null, 99.9, null, "test"), TestMarket.Now));
        Assert.Equal("instrumentId", quote.Field);
        Assert.Equal(before, EngineState.Of(engine));
    }

    public static TheoryData<string, double?, double?, int, string> BadQuotes() => new()
    {
        { "XX-0000", 99.0, null, 0, "instrumentId" },
        { "VGB-2034-11", null, null, 24 * 60, "quoteTime" },      // a day ahead of the clock
        { "VGB-2034-11", 99.0, null, 10, "quoteTime" },            // ten minutes ahead (5 allowed for clock skew)
        { "VGB-2034-11", 99.0, null, -8 * 24 * 60, "quoteTime" },  // eight days old
        { "VGB-2034-11", null, -0.5, 0, "yield" },                 // -50%: outside [-20%, 100%]
    };

    [Theory]
    [MemberData(nameof(BadQuotes))]
    public void Bad_quotes_are_rejected_naming_the_field_and_leave_state_unchanged(string instrument, double? mid, double? yield, int minutesFromNow, string field)
    {
        var engine = TestMarket.OpenedEngine();
        var before = EngineState.Of(engine);
        var ex = Assert.Throws<MessageRejectedException>(() =>
        {
            var quote = Monitor.Service.Consumers.InboundMapper.ToQuote(new Monitor.Contracts.V1.BondQuoted
            {
                QuoteId = "q-1",
                InstrumentId = instrument,
                MidCleanPrice = mid ?? (yield is null ? 99.0 : null),
                Yield = yield,
                QuoteTime = TestMarket.Now.AddMinutes(minutesFromNow),
                Source = "test",
            });
            engine.AcceptQuote(quote, TestMarket.Now);
        });
        Assert.Equal(field, ex.Field);
        Assert.Equal(before, EngineState.Of(engine));
        Assert.Empty(engine.DirtyCurves());
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(-99.0)]
    [InlineData(0.0)]
    [InlineData(5000.0)]
    public void Absurd_prices_are_rejected_by_the_inbound_mapper_naming_the_field(double price)
    {
        var ex = Assert.Throws<MessageRejectedException>(() => Monitor.Service.Consumers.InboundMapper.ToQuote(new Monitor.Contracts.V1.BondQuoted
        {
            QuoteId = "q-1",
            InstrumentId = "VGB-2034-11",
            MidCleanPrice = price,
            QuoteTime = TestMarket.Now,
            Source = "test",
        }));
        Assert.Equal("midCleanPrice", ex.Field);
        Assert.Contains(price.ToString(System.Globalization.CultureInfo.InvariantCulture), ex.Message, StringComparison.Ordinal);
    }
}
