using Monitor.Contracts.V1;
using Monitor.Service.Consumers;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Support;
using Xunit.Abstractions;

namespace Monitor.Service.Tests.Engine;

/// <summary>
/// Issue 5's bad-input property: 10,000+ random and mutated messages through the consumers' path (InboundMapper, then
/// the engine): nothing crashes, a rejected message changes no state, and every rejection names its field and
/// carries a reason. A seeded generator (seed printed) keeps any failure reproducible.
/// </summary>
public sealed class RandomMessagePropertyTests(ITestOutputHelper output)
{
    private const int Seed = 20260601;
    private static readonly string[] Books = ["RATES-CORE", "RATES-CURVE", "CREDIT-IG", "NO-SUCH-BOOK", "", " ", "rates-core"];
    private static readonly string[] Instruments = ["VGB-2034-11", "VGB-2028-05", "QFU-2029-03", "KWS-2035-03", "XX-0000", "", "vgb-2034-11"];
    private static readonly string?[] Actions = ["new", "amend", "cancel", "NEW", " Cancel ", "buy", "", null];
    private static readonly double[] Faces = [1_000_000, -500_000, 2_500_000, 0, double.NaN, double.PositiveInfinity, double.NegativeInfinity, 1e13, -1e13, double.Epsilon];
    private static readonly double?[] Prices = [99.5, 101.25, 100, 0, -1, double.NaN, double.PositiveInfinity, 1e5, 1e-300, null];
    private static readonly double?[] Yields = [0.035, 0.04, -0.3, 1.5, double.NaN, double.NegativeInfinity, 0, null];

    [Fact]
    public void Ten_thousand_random_messages_never_crash_and_rejections_change_nothing()
    {
        var random = new Random(Seed);
        var engine = TestMarket.OpenedEngine();
        int accepted = 0, rejected = 0;
        for (var i = 0; i < 10_000; i++)
        {
            var before = EngineState.Of(engine);
            var kind = random.Next(3);
            try
            {
                switch (kind)
                {
                    case 0:
                        engine.ApplyTrade(InboundMapper.ToTrade(RandomTrade(random)), TestMarket.Now);
                        break;
                    case 1:
                        engine.AcceptQuote(InboundMapper.ToQuote(RandomQuote(random)), TestMarket.Now);
                        break;
                    default:
                        var message = RandomParYields(random);
                        engine.ApplyParYields(message.CurveId, message.AsOf, InboundMapper.ToParYields(message), TestMarket.Now);
                        break;
                }
                accepted++;
            }
            catch (MessageRejectedException ex)
            {
                rejected++;
                Assert.False(string.IsNullOrWhiteSpace(ex.Field), $"seed {Seed}, message {i}: a rejection without a field");
                Assert.False(string.IsNullOrWhiteSpace(ex.Reason), $"seed {Seed}, message {i}: a rejection without a reason");
                Assert.StartsWith(ex.Field + ":", ex.Message, StringComparison.Ordinal);
                Assert.True(before == EngineState.Of(engine), $"seed {Seed}, message {i} (kind {kind}) was rejected ({ex.Message}) but changed state");
            }
        }
        Fuzz.FiguresFile.Report(output, $"bad input (engine): 10000 random messages tried (seed {Seed}); refused {rejected} with a field and reason, none changing state; accepted {accepted}");
        Assert.True(rejected > 3000 && accepted > 1000, $"the generator should mix good and bad messages: {accepted} accepted, {rejected} rejected");
    }

    private static T Pick<T>(Random r, T[] values) => values[r.Next(values.Length)];

    private static TradeBooked RandomTrade(Random r)
    {
        var trade = ServiceUnderTest.Trade("T-" + r.Next(25), 1, "new", "RATES-CORE", "VGB-2034-11", 1_000_000);
        trade = trade with { Version = r.Next(10) < 6 ? 1 + r.Next(3) : Pick(r, new[] { 0, -1, 7, int.MaxValue }) };
        trade = trade with { Action = r.Next(10) < 7 ? (trade.Version == 1 ? "new" : Pick(r, new[] { "amend", "cancel" })) : Pick(r, Actions)! };
        for (var m = r.Next(4); m > 0; m--)
        {
            trade = r.Next(6) switch
            {
                0 => trade with { Book = Pick(r, Books) },
                1 => trade with { InstrumentId = Pick(r, Instruments) },
                2 => trade with { FaceAmount = Pick(r, Faces) },
                3 => trade with { CleanPrice = Pick(r, Prices) ?? double.NaN },
                4 => trade with { TradeId = Pick(r, new[] { "", " ", "T-1", "T-2" }) },
                _ => trade with { TradeTime = Pick(r, new[] { DateTimeOffset.MinValue, DateTimeOffset.MaxValue, TestMarket.Now.AddDays(30) }) },
            };
        }
        return trade;
    }

    private static BondQuoted RandomQuote(Random r)
    {
        var quote = new BondQuoted
        {
            QuoteId = "q",
            InstrumentId = Pick(r, Instruments),
            MidCleanPrice = Pick(r, Prices),
            BidCleanPrice = r.Next(3) == 0 ? Pick(r, Prices) : null,
            AskCleanPrice = r.Next(3) == 0 ? Pick(r, Prices) : null,
            Yield = r.Next(3) == 0 ? Pick(r, Yields) : null,
            QuoteTime = TestMarket.Now.AddMinutes(-r.Next(600)),
            Source = "random",
        };
        if (r.Next(8) == 0)
        {
            quote = quote with { QuoteTime = Pick(r, new[] { DateTimeOffset.MinValue, DateTimeOffset.MaxValue, TestMarket.Now.AddHours(2), TestMarket.Now.AddDays(-10) }) };
        }
        return quote;
    }

    private static ParYieldsPublished RandomParYields(Random r)
    {
        string[] tenors = ["1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"];
        var points = tenors.Select(t => new Contracts.V1.ParYieldPoint { Tenor = t, ParYield = 0.03 + 0.0004 * Array.IndexOf(tenors, t) }).ToArray();
        var i = r.Next(points.Length);
        points[i] = r.Next(5) switch
        {
            0 => points[i] with { Tenor = Pick(r, new[] { "", "10X", "-1Y", "0M", "3Y" }) },
            1 => points[i] with { ParYield = Pick(r, Yields) ?? double.NaN },
            _ => points[i],
        };
        return new ParYieldsPublished
        {
            CurveId = r.Next(4) == 0 ? Pick(r, new[] { "UTIL-A", "", "Government" }) : "government",
            AsOf = r.Next(6) == 0 ? TestMarket.Now.AddDays(-9) : TestMarket.Now,
            Points = r.Next(20) == 0 ? [] : points,
            Source = "random",
        };
    }
}
