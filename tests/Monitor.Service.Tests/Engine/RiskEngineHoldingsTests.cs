using Monitor.Analytics.Curves;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Analytics.Risk;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

/// <summary>
/// The engine's holdings path (instrument rows x book quantities, per curve key) against the straightforward
/// computations on randomized books (seeded): <see cref="BookRiskCalculator"/> on each book's cash flows merged by date,
/// and <see cref="PositionRisk"/> position by position. Exposures are linear in the cash flows (see the remarks of
/// <see cref="FactorExposures"/>: Fisher and Weil 1971 duration, sums over flows), so all three must agree up to
/// rounding; the tolerance is 1e-9 of the gross figure (sum of the positions' absolute figures), common practice, no source.
/// </summary>
public sealed class RiskEngineHoldingsTests : IDisposable
{
    private const double RelativeTolerance = 1e-9;
    private static readonly string[] BookIds = ["B1", "B2", "B3", "B4", "B5", "B6", "B7", "B8"];
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Figures_after_random_trades_amends_cancels_and_refits_match_the_ledger_and_the_positions(int seed)
    {
        var random = new Random(seed);
        var engine = OpenedEngine();
        var tradable = Tradable(engine);
        foreach (var book in BookIds)
        {
            for (var i = 0; i < 6; i++)
            {
                engine.LoadPosition(book, tradable[random.Next(tradable.Length)], Face(random));
            }
        }
        engine.RevalueAll(TestMarket.Now);
        AssertMatchesReference(engine);

        var trades = new RandomTrades(random, tradable);
        for (var step = 0; step < 60; step++)
        {
            var result = engine.ApplyTrade(trades.Next(), TestMarket.Now);
            Assert.Equal(TradeOutcome.Applied, result.Trade);
            if (step % 10 == 9)
            {
                AssertMatchesReference(engine);
            }
        }

        // A government refit (quotes part of the way to the close) refits the spread curves on it and revalues every book.
        var refit = Refit(engine, TestMarket.Between(0.2 + 0.1 * seed, TestMarket.Now.AddMinutes(-20)));
        Assert.Contains(refit.Curves, c => CurveKey.IsGovernment(c.CurveKey) && c.Accepted);
        Assert.Equal(BookIds, refit.Books.Select(b => b.Book).Order(StringComparer.Ordinal));
        AssertMatchesReference(engine);

        for (var step = 0; step < 30; step++)
        {
            engine.ApplyTrade(trades.Next(), TestMarket.Now);
        }
        AssertMatchesReference(engine);
    }

    [Fact]
    public void A_trade_revalues_its_book_only_and_builds_no_instrument_rows()
    {
        var engine = OpenedEngine();
        var tradable = Tradable(engine);
        var random = new Random(7);
        foreach (var book in BookIds)
        {
            engine.LoadPosition(book, tradable[random.Next(tradable.Length)], Face(random));
        }
        engine.RevalueAll(TestMarket.Now);
        var risk = engine.Books.Values.ToDictionary(b => b.Id, b => b.Risk);
        var builds = engine.InstrumentRowBuilds;

        // An instrument no book held yet: its flows were registered with the instruments, so its row is ready too.
        var unheld = tradable.First(id => engine.Books.Values.All(b => !b.Positions.ContainsKey(id)));
        var result = engine.ApplyTrade(new TradeInput("T-1", 1, TradeAction.New, "B3", unheld, 3_000_000, 99, TestMarket.Now), TestMarket.Now);

        Assert.Equal("B3", Assert.Single(result.Books).Book);
        Assert.Equal(builds, engine.InstrumentRowBuilds);
        foreach (var book in engine.Books.Values.Where(b => b.Id != "B3"))
        {
            Assert.Same(risk[book.Id], book.Risk);
        }
        Assert.NotSame(risk["B3"], engine.Books["B3"].Risk);
        AssertMatchesReference(engine);
    }

    [Fact]
    public void A_spread_refit_rebuilds_its_own_rows_and_revalues_only_the_books_holding_the_group()
    {
        var engine = OpenedEngine();
        var credit = Tradable(engine).First(id => engine.Instruments[id].SpreadGroup == "INDUSTRIAL-BBB");
        var government = Tradable(engine).First(id => engine.Instruments[id].SpreadGroup is null);
        engine.LoadPosition("B1", credit, 5_000_000);
        engine.LoadPosition("B2", government, 5_000_000);
        engine.LoadPosition("B2", credit, -2_000_000);
        engine.LoadPosition("B3", government, 8_000_000);
        engine.RevalueAll(TestMarket.Now);
        var builds = engine.InstrumentRowBuilds;

        var groupQuotes = TestMarket.OpenQuotes().Where(q => engine.Instruments[q.InstrumentId].SpreadGroup == "INDUSTRIAL-BBB").ToArray();
        var result = Refit(engine, TestMarket.Shifted(groupQuotes, -0.4, TestMarket.Now.AddMinutes(-10)));

        var fit = Assert.Single(result.Curves);
        Assert.True(fit.Accepted);
        Assert.Equal("INDUSTRIAL-BBB", fit.CurveKey);
        Assert.Equal(["B1", "B2"], result.Books.Select(b => b.Book).Order(StringComparer.Ordinal));
        Assert.Equal(builds + 1, engine.InstrumentRowBuilds); // the group's rows; the government rows are still current
        AssertMatchesReference(engine);
    }

    [Fact]
    public void A_redefined_unheld_instrument_is_valued_on_its_new_terms()
    {
        var engine = OpenedEngine();
        engine.DefineInstrument(Bond("VGB-2040-03", null, 0.03m, new DateOnly(2040, 3, 15)));
        engine.LoadPosition("B1", "VGB-2040-03", 10_000_000);
        engine.RevalueAll(TestMarket.Now);
        var before = engine.Books["B2"].Exposures!.Totals[ExposureMeasure.MarketValue];

        // B1 closes the position, then the bond is redefined: another coupon, maturity and curve key.
        engine.LoadPosition("B1", "VGB-2040-03", -10_000_000);
        engine.DefineInstrument(Bond("VGB-2040-03", "INDUSTRIAL-BBB", 0.045m, new DateOnly(2037, 9, 15)));
        engine.LoadPosition("B2", "VGB-2040-03", 4_000_000);
        engine.RevalueAll(TestMarket.Now);

        Assert.Equal(["INDUSTRIAL-BBB"], engine.Books["B2"].CurveKeys);
        Assert.Empty(engine.Books["B1"].CurveKeys);
        Assert.NotEqual(before, engine.Books["B2"].Exposures!.Totals[ExposureMeasure.MarketValue]);
        Assert.True(engine.Books["B2"].Exposures!.BySpreadGroup["INDUSTRIAL-BBB"][ExposureMeasure.SpreadLevel] > 0);
        AssertMatchesReference(engine);
    }

    [Fact]
    public void A_book_holding_a_group_without_a_curve_is_valued_provisionally_and_a_matured_bond_does_not_make_it_so()
    {
        var engine = OpenedEngine(); // UTIL-A has 3 quotes, fewer than the 4 its gate asks for: no curve
        Assert.Null(engine.Curves["UTIL-A"].Curve);
        engine.DefineInstrument(Bond("OLD-2026-03", "OLD-GROUP", 0.02m, new DateOnly(2026, 3, 15)));
        engine.LoadPosition("B1", "QFU-2029-03", 1_000_000);
        engine.LoadPosition("B2", "OLD-2026-03", 1_000_000);
        engine.LoadPosition("B2", "VGB-2034-11", 1_000_000);
        var lastFigures = engine.Books["B1"].Exposures; // of the empty book, from the opening refit

        var result = engine.RevalueAll(TestMarket.Now);

        Assert.Equal(["B1"], result.BooksAwaitingCurves);
        Assert.NotSame(lastFigures, engine.Books["B1"].Exposures); // valued on a stand-in spread, never left out
        Assert.Contains("QFU-2029-03", Assert.Single(engine.Books["B1"].ProvisionalReasons), StringComparison.Ordinal);
        Assert.Empty(engine.Books["B2"].ProvisionalReasons);
        Assert.Equal([CurveKey.Government], engine.Books["B2"].CurveKeys); // the matured bond has no flows left to value
        Assert.Equal(1_000_000, engine.Books["B2"].Positions["OLD-2026-03"]);
        AssertMatchesReference(engine);
    }

    [Theory]
    [InlineData(4)]
    [InlineData(5)]
    public void Measures_read_from_the_moment_rows_equal_the_mapping_of_the_books_factor_exposures_bit_for_bit(int seed)
    {
        var random = new Random(seed);
        var engine = OpenedEngine();
        var tradable = Tradable(engine);
        foreach (var book in BookIds.Skip(1)) // B1 stays empty: its figures are all zero
        {
            for (var i = 0; i < random.Next(1, 8); i++)
            {
                engine.LoadPosition(book, tradable[random.Next(tradable.Length)], Face(random));
            }
        }
        var all = engine.RevalueAll(TestMarket.Now);
        var refit = Refit(engine, TestMarket.Between(0.5, TestMarket.Now.AddMinutes(-20)));
        var trade = engine.ApplyTrade(new TradeInput("T-9", 1, TradeAction.New, "B2", tradable[0], 1_000_000, 99, TestMarket.Now), TestMarket.Now);

        Assert.Contains(all.Books, u => u.Exposures.BySpreadGroup.Count > 0);
        foreach (var update in all.Books.Concat(refit.Books).Concat(trade.Books))
        {
            // The straightforward path: the book's FactorExposures (total summed key by key) through ExposureMapping.
            var expected = ExposureMapping.ToBookExposures(update.Risk);
            AssertSameBits(expected.Totals, update.Exposures.Totals, update.Book);
            Assert.Equal(expected.BySpreadGroup.Keys, update.Exposures.BySpreadGroup.Keys);
            foreach (var (group, figures) in expected.BySpreadGroup)
            {
                AssertSameBits(figures, update.Exposures.BySpreadGroup[group], $"{update.Book} {group}");
            }
        }
        foreach (var update in refit.Books.Where(u => u.Book != "B2")) // B2 traded since: its state holds the trade's figures
        {
            Assert.Same(engine.Books[update.Book].Risk, update.Risk);
        }
        Assert.All(engine.Books["B1"].Exposures!.Totals.Values, v => Assert.Equal(0.0, v));
    }

    [Fact]
    public void A_thousand_books_sharing_blocks_of_moment_rows_each_read_their_own_rows()
    {
        // Past the 8,192 doubles of one block: 1,000 books of 10 (government) or 38 (with a spread group) doubles each.
        string[] books = [.. Enumerable.Range(0, 1_000).Select(b => $"M{b:D4}")];
        var engine = OpenedEngine(books);
        var tradable = Tradable(engine);
        var random = new Random(8);
        foreach (var book in books)
        {
            engine.LoadPosition(book, tradable[random.Next(tradable.Length)], Face(random));
            engine.LoadPosition(book, tradable[random.Next(tradable.Length)], Face(random));
        }

        var result = engine.RevalueAll(TestMarket.Now);

        Assert.Equal(books.Length, result.Books.Count);
        foreach (var update in result.Books)
        {
            var expected = ExposureMapping.ToBookExposures(update.Risk);
            AssertSameBits(expected.Totals, update.Exposures.Totals, update.Book);
            Assert.Equal(engine.Books[update.Book].CurveKeys, update.Risk.ByCurveKey.Keys.Order(StringComparer.Ordinal));
        }
        Assert.Contains(result.Books, u => u.Exposures.BySpreadGroup.Count > 0);
        Assert.Contains(result.Books, u => u.Exposures.BySpreadGroup.Count == 0);
    }

    [Fact]
    public void An_update_keeps_its_own_factor_exposures_after_its_book_is_revalued_again()
    {
        var engine = OpenedEngine();
        var tradable = Tradable(engine);
        engine.LoadPosition("B3", tradable[0], 5_000_000);
        var first = Assert.Single(engine.RevalueAll(TestMarket.Now).Books, u => u.Book == "B3");

        var second = Assert.Single(engine.ApplyTrade(new TradeInput("T-1", 1, TradeAction.New, "B3", tradable[^1], 7_000_000, 99, TestMarket.Now), TestMarket.Now).Books);

        // Read only now, after B3 moved on: the first update's factors are still those of its own figures.
        Assert.Equal(first.Exposures.Totals[ExposureMeasure.MarketValue], first.Risk.Total.Value);
        Assert.Equal(second.Exposures.Totals[ExposureMeasure.MarketValue], second.Risk.Total.Value);
        Assert.NotEqual(first.Risk.Total.Value, second.Risk.Total.Value);
        Assert.Same(second.Risk, engine.Books["B3"].Risk);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(3)]
    public void Measures_from_a_moment_row_equal_those_of_the_factor_exposures_it_makes(int spreadFactors)
    {
        var random = new Random(11 + spreadFactors);
        var n = 3 + spreadFactors;
        var row = Enumerable.Range(0, 1 + n + n * (n + 1) / 2).Select(_ => (random.NextDouble() - 0.4) * 1e7).ToArray();
        var exposures = FactorExposures.FromMoments(3, spreadFactors, row);
        var measures = new double[MeasureFigures.MeasureCount];

        ExposureMapping.MeasuresFromMoments(3, spreadFactors, row[0], row.AsSpan(1, n), row[1 + n], measures);

        AssertSameBits(ExposureMapping.Measures(exposures), new MeasureFigures(measures), $"{spreadFactors} spread factors");
        Assert.Throws<ArgumentException>(() => FactorExposures.FromMoments(3, spreadFactors, row.AsSpan(1)));
    }

    private static void AssertSameBits(IReadOnlyDictionary<ExposureMeasure, double> expected, IReadOnlyDictionary<ExposureMeasure, double> actual, string what)
    {
        Assert.Equal(expected.Keys, actual.Keys);
        foreach (var (measure, value) in expected)
        {
            Assert.True(BitConverter.DoubleToInt64Bits(value) == BitConverter.DoubleToInt64Bits(actual[measure]),
                $"{what} {measure}: expected {value:R}, got {actual[measure]:R}");
        }
    }

    private RiskEngine OpenedEngine(string[]? books = null)
    {
        var limits = _folder.Combine("limits.json");
        File.WriteAllText(limits, $$"""
            {
              "schemaVersion": 1,
              "firm": "test-firm",
              "defaults": { "warning": 0.8, "hysteresis": 0.05 },
              "desks": [ { "id": "mixed", "books": [{{string.Join(", ", (books ?? BookIds).Select(b => $"\"{b}\""))}}] } ],
              "limits": [ { "id": "firm-value", "scope": "firm", "measure": "marketValue", "lower": -1000000000000, "upper": 1000000000000 } ]
            }
            """);
        var options = TestMarket.Options(limits);
        options.PositionsFile = null;
        var engine = EngineFactory.Create(options, new ManualClock(TestMarket.Now));
        Refit(engine, TestMarket.OpenQuotes());
        Assert.NotNull(engine.Curves[CurveKey.Government].Curve);
        Assert.NotNull(engine.Curves["INDUSTRIAL-BBB"].Curve);
        return engine;
    }

    private static EngineResult Refit(RiskEngine engine, IEnumerable<BondQuote> quotes)
    {
        foreach (var quote in quotes)
        {
            engine.AcceptQuote(quote, TestMarket.Now);
        }
        return engine.RefitDirtyCurves(TestMarket.Now);
    }

    /// <summary>Bonds on a fitted curve (government and INDUSTRIAL-BBB), so books holding them are always valued.</summary>
    private static string[] Tradable(RiskEngine engine) =>
        [.. engine.Instruments.Values.Where(b => b.SpreadGroup is null || b.SpreadGroup == "INDUSTRIAL-BBB").Select(b => b.Id).Order(StringComparer.Ordinal)];

    /// <summary>0.1m to 30m face, long or short (never 0: a trade of nothing is refused).</summary>
    private static double Face(Random random) => (random.Next(2) == 0 ? -1 : 1) * random.Next(1, 301) * 100_000.0;

    private static Bond Bond(string id, string? group, decimal coupon, DateOnly maturity) =>
        new(id, "Veloria Test Issuer", group, "XTS", coupon, 2, DayCounters.Parse("ACT/ACT-ICMA"), new DateOnly(2024, 3, 15), null, maturity, 100m, 1);

    /// <summary>Every valued book's figures, in total, per spread group and per curve key, against the two references.</summary>
    private static void AssertMatchesReference(RiskEngine engine)
    {
        var government = engine.Curves[CurveKey.Government].Curve!;
        var spreads = engine.Curves.Values.Where(c => !CurveKey.IsGovernment(c.Key) && c.Curve is not null)
            .ToDictionary(c => c.Key, c => c.Curve!, StringComparer.Ordinal);
        var valued = 0;
        foreach (var book in engine.Books.Values)
        {
            if (book.CurveKeys.Any(k => !CurveKey.IsGovernment(k) && !spreads.ContainsKey(k)))
            {
                continue; // valued on stand-in spreads (RiskEngineProvisionalTests)
            }
            valued++;
            var dates = new CashFlowDateIndex();
            var ledger = new BookCashFlowLedger(dates);
            var byPosition = new List<(string Key, IReadOnlyDictionary<ExposureMeasure, double> Measures)>();
            foreach (var (id, face) in book.Positions)
            {
                var bond = engine.Instruments[id];
                var flows = bond.MaturityDate > engine.ValuationDate ? bond.CashFlowsAfter(engine.ValuationDate) : [];
                ledger.Add(bond.SpreadGroup, flows, face / 100.0);
                var position = PositionRisk.Compute(flows, engine.ValuationDate, government, bond.SpreadGroup is null || flows.Count == 0 ? null : spreads[bond.SpreadGroup], face / 100.0);
                byPosition.Add((CurveKey.Normalize(bond.SpreadGroup), ExposureMapping.Measures(position)));
            }
            var grid = CurveGrid.Build(dates, engine.ValuationDate, government, spreads.ToDictionary(s => s.Key, s => (IFactorCurve)s.Value, StringComparer.Ordinal));
            var expectedRisk = BookRiskCalculator.Compute(ledger, grid);
            var expected = ExposureMapping.ToBookExposures(expectedRisk);
            var actual = book.Exposures;
            Assert.NotNull(actual);
            Assert.NotNull(book.Risk);

            foreach (var (measure, value) in expected.Totals)
            {
                var gross = byPosition.Sum(p => Math.Abs(p.Measures[measure]));
                AssertClose(value, actual.Totals[measure], gross, $"{book.Id} {measure} (ledger)");
                AssertClose(byPosition.Sum(p => p.Measures[measure]), actual.Totals[measure], gross, $"{book.Id} {measure} (positions)");
            }
            Assert.Equal(expected.BySpreadGroup.Keys.Order(StringComparer.Ordinal), actual.BySpreadGroup.Keys.Order(StringComparer.Ordinal));
            foreach (var (group, figures) in expected.BySpreadGroup)
            {
                foreach (var (measure, value) in figures)
                {
                    var inGroup = byPosition.Where(p => p.Key == group).ToArray();
                    var gross = inGroup.Sum(p => Math.Abs(p.Measures[measure]));
                    AssertClose(value, actual.BySpreadGroup[group][measure], gross, $"{book.Id} {group} {measure} (ledger)");
                    AssertClose(inGroup.Sum(p => p.Measures[measure]), actual.BySpreadGroup[group][measure], gross, $"{book.Id} {group} {measure} (positions)");
                }
            }
            Assert.Equal(expectedRisk.ByCurveKey.Keys.Order(StringComparer.Ordinal), book.Risk.ByCurveKey.Keys.Order(StringComparer.Ordinal));
            foreach (var (key, exposures) in expectedRisk.ByCurveKey)
            {
                var engineKey = book.Risk.ByCurveKey[key];
                Assert.Equal(exposures.SpreadFactorCount, engineKey.SpreadFactorCount);
                var gross = byPosition.Where(p => p.Key == key).Sum(p => Math.Abs(p.Measures[ExposureMeasure.MarketValue]));
                AssertClose(exposures.Value, engineKey.Value, gross, $"{book.Id} key '{key}' value");
                AssertClose(exposures.BaseMoneyConvexity(1, 2), engineKey.BaseMoneyConvexity(1, 2), Math.Abs(exposures.BaseMoneyConvexity(1, 2)) + gross, $"{book.Id} key '{key}' cross-convexity");
            }
        }
        Assert.True(valued > 0);
    }

    private static void AssertClose(double expected, double actual, double gross, string what)
    {
        var tolerance = RelativeTolerance * Math.Max(gross, Math.Abs(expected));
        Assert.True(Math.Abs(expected - actual) <= tolerance,
            $"{what}: engine {actual:R}, reference {expected:R}, difference {Math.Abs(expected - actual):R} > {tolerance:R}");
    }

    /// <summary>New trades into random books, amends (face, book or bond) and cancels of live ones, versions in order.</summary>
    private sealed class RandomTrades(Random random, string[] instruments)
    {
        private readonly List<TradeInput> _live = [];
        private int _next;

        public TradeInput Next()
        {
            var roll = random.NextDouble();
            if (_live.Count == 0 || roll < 0.5)
            {
                var trade = new TradeInput($"T-{++_next}", 1, TradeAction.New, Pick(BookIds), Pick(instruments), Face(random), 99.5, TestMarket.Now);
                _live.Add(trade);
                return trade;
            }
            var at = random.Next(_live.Count);
            var current = _live[at];
            if (roll < 0.8)
            {
                var amended = current with
                {
                    Version = current.Version + 1,
                    Action = TradeAction.Amend,
                    FaceAmount = random.NextDouble() < 0.6 ? Face(random) : current.FaceAmount,
                    Book = random.NextDouble() < 0.3 ? Pick(BookIds) : current.Book,
                    InstrumentId = random.NextDouble() < 0.3 ? Pick(instruments) : current.InstrumentId,
                };
                _live[at] = amended;
                return amended;
            }
            _live.RemoveAt(at);
            return current with { Version = current.Version + 1, Action = TradeAction.Cancel };
        }

        private T Pick<T>(T[] items) => items[random.Next(items.Length)];
    }
}
