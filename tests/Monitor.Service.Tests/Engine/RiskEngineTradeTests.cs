using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

/// <summary>Trades by id and version: exactly-once effect on at-least-once delivery (issue 5; common practice, no source).</summary>
public sealed class RiskEngineTradeTests
{
    private static readonly DateTimeOffset TradeTime = TestMarket.Now.AddMinutes(-5);

    private static TradeInput Trade(int version, TradeAction action, double face, string book = "RATES-CORE", string instrument = "VGB-2034-11", double price = 100.5) =>
        new("T-1", version, action, book, instrument, face, price, TradeTime);

    private static double Position(RiskEngine engine, string book, string id) => engine.Books[book].Positions.GetValueOrDefault(id);

    [Fact]
    public void New_amend_cancel_move_the_position_and_revalue_only_the_book()
    {
        var engine = TestMarket.OpenedEngine();
        var curveValue = engine.Books["RATES-CURVE"].Exposures!.Totals[ExposureMeasure.MarketValue];
        var dv01Before = engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];

        var booked = engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        Assert.Equal(TradeOutcome.Applied, booked.Trade);
        Assert.Equal(10_000_000, Position(engine, "RATES-CORE", "VGB-2034-11"));
        Assert.Equal("RATES-CORE", Assert.Single(booked.Books).Book);
        var dv01Booked = engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];
        Assert.True(dv01Booked > dv01Before);

        // DV01 is linear in position: amending 10m to 20m adds the same DV01 again (definition of DV01 as a sum over positions).
        engine.ApplyTrade(Trade(2, TradeAction.Amend, 20_000_000), TestMarket.Now);
        Assert.Equal(20_000_000, Position(engine, "RATES-CORE", "VGB-2034-11"));
        var dv01Amended = engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];
        Assert.Equal(2 * (dv01Booked - dv01Before), dv01Amended - dv01Before, 1e-6 * dv01Amended);

        engine.ApplyTrade(Trade(3, TradeAction.Cancel, 20_000_000), TestMarket.Now);
        Assert.Equal(0, Position(engine, "RATES-CORE", "VGB-2034-11"));
        Assert.Equal(dv01Before, engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01], 1e-6 * dv01Before);
        Assert.Equal(curveValue, engine.Books["RATES-CURVE"].Exposures!.Totals[ExposureMeasure.MarketValue]);
    }

    [Fact]
    public void An_amend_can_move_a_trade_to_another_book()
    {
        var engine = TestMarket.OpenedEngine();
        engine.ApplyTrade(Trade(1, TradeAction.New, 5_000_000), TestMarket.Now);
        var moved = engine.ApplyTrade(Trade(2, TradeAction.Amend, 5_000_000, book: "RATES-CURVE"), TestMarket.Now);
        Assert.Equal(0, Position(engine, "RATES-CORE", "VGB-2034-11"));
        Assert.Equal(5_000_000, Position(engine, "RATES-CURVE", "VGB-2034-11"));
        Assert.Equal(["RATES-CORE", "RATES-CURVE"], moved.Books.Select(b => b.Book).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void A_redelivery_changes_nothing()
    {
        var engine = TestMarket.OpenedEngine();
        engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        var before = EngineState.Of(engine);
        var again = engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        Assert.Equal(TradeOutcome.Duplicate, again.Trade);
        Assert.Empty(again.Books);
        Assert.Equal(before, EngineState.Of(engine));
    }

    [Fact]
    public void An_older_version_after_a_newer_one_is_ignored()
    {
        var engine = TestMarket.OpenedEngine();
        engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        engine.ApplyTrade(Trade(2, TradeAction.Amend, 15_000_000), TestMarket.Now);
        var before = EngineState.Of(engine);
        var late = engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        Assert.Equal(TradeOutcome.Superseded, late.Trade);
        Assert.Equal(before, EngineState.Of(engine));
        Assert.Equal(15_000_000, Position(engine, "RATES-CORE", "VGB-2034-11"));
    }

    [Fact]
    public void A_version_gap_is_rejected()
    {
        var engine = TestMarket.OpenedEngine();
        engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        var before = EngineState.Of(engine);
        var ex = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(Trade(3, TradeAction.Amend, 12_000_000), TestMarket.Now));
        Assert.Equal("version", ex.Field);
        Assert.Equal("3", ex.Value);
        Assert.Equal(before, EngineState.Of(engine));

        var unknown = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(Trade(2, TradeAction.Amend, 1_000_000) with { TradeId = "T-9" }, TestMarket.Now));
        Assert.Equal("version", unknown.Field);
    }

    [Fact]
    public void A_different_payload_under_an_applied_version_is_a_conflict_naming_both_payloads()
    {
        var engine = TestMarket.OpenedEngine();
        engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        var before = EngineState.Of(engine);
        var ex = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(Trade(1, TradeAction.New, 11_000_000), TestMarket.Now));
        Assert.Equal("version", ex.Field);
        Assert.Contains("10000000", ex.Message, StringComparison.Ordinal);
        Assert.Contains("11000000", ex.Message, StringComparison.Ordinal);
        Assert.Equal(before, EngineState.Of(engine));
    }

    [Fact]
    public void Nothing_follows_a_cancellation()
    {
        var engine = TestMarket.OpenedEngine();
        engine.ApplyTrade(Trade(1, TradeAction.New, 10_000_000), TestMarket.Now);
        engine.ApplyTrade(Trade(2, TradeAction.Cancel, 10_000_000), TestMarket.Now);
        var ex = Assert.Throws<MessageRejectedException>(() => engine.ApplyTrade(Trade(3, TradeAction.Amend, 10_000_000), TestMarket.Now));
        Assert.Equal("action", ex.Field);
    }
}
