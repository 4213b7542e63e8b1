using Monitor.Analytics.Pricing;
using Monitor.Cli.Demo;
using Monitor.Cli.Load;
using Monitor.Files;
using Monitor.Limits;

namespace Monitor.Cli.Tests.Load;

/// <summary>The generated book set is read by the service's own parsers (formats: config/examples/README.md, src/Monitor.Limits/README.md).</summary>
public sealed class LoadScenarioTests
{
    private static readonly LoadScenario Scenario = LoadScenario.Generate(books: 120, seed: 7);

    [Fact]
    public void The_instruments_are_forty_distinct_government_bonds_maturing_after_the_valuation_date()
    {
        var bonds = InstrumentFile.Read(new StringReader(Scenario.InstrumentsCsv), "instruments.csv");
        Assert.Equal(LoadScenario.BondCount, bonds.Count);
        Assert.Equal(bonds.Count, bonds.Select(b => b.Id).Distinct().Count());
        Assert.All(bonds, b =>
        {
            Assert.Null(b.SpreadGroup);
            Assert.True(b.IssueDate < DemoScenario.TradeDate, b.Id);
            Assert.True(b.MaturityDate > DemoScenario.ValuationDate.AddMonths(6), b.Id);
        });
    }

    [Fact]
    public void Every_book_holds_long_positions_in_known_bonds()
    {
        var bonds = InstrumentFile.Read(new StringReader(Scenario.InstrumentsCsv), "instruments.csv").Select(b => b.Id).ToHashSet();
        var positions = PositionFile.Read(new StringReader(Scenario.PositionsCsv), "positions.csv");
        var books = positions.GroupBy(p => p.Book).ToList();
        Assert.Equal(120, books.Count);
        Assert.All(books, g => Assert.InRange(g.Count(), 1, LoadScenario.PositionsPerBook));
        Assert.All(positions, p =>
        {
            Assert.Contains(p.InstrumentId, bonds);
            Assert.InRange(p.FaceAmount, 1_000_000, 20_000_000);
        });
    }

    [Fact]
    public void Each_book_has_a_value_limit_whose_opening_use_sits_around_the_warning_level()
    {
        var limits = LimitsFileParser.Parse(Scenario.LimitsJson);
        Assert.Equal(120, limits.Limits.Count);
        var bonds = InstrumentFile.Read(new StringReader(Scenario.InstrumentsCsv), "instruments.csv").ToDictionary(b => b.Id);
        var positions = PositionFile.Read(new StringReader(Scenario.PositionsCsv), "positions.csv");
        var curve = new MarketPath(7, 1).Government(0, 0);
        foreach (var limit in limits.Limits)
        {
            Assert.Equal(ExposureMeasure.MarketValue, limit.Measure);
            Assert.Equal(LoadScenario.HysteresisFraction, limit.HysteresisFraction);
            // Value = sum of face x dirty price / 100 on the opening curve (the textbook definition of a bond position's value).
            var value = positions.Where(p => p.Book == limit.Scope.Id)
                .Sum(p => p.FaceAmount * CurvePricing.DirtyPrice(bonds[p.InstrumentId], curve, DemoScenario.ValuationDate, QuoteFactory.SettlementOf(bonds[p.InstrumentId])) / 100.0);
            Assert.InRange(value / limit.Upper!.Value, 0.79 - 1e-9, 0.83 + 1e-9);
        }
    }

    [Fact]
    public void The_same_seed_gives_the_same_books_and_another_seed_other_books()
    {
        Assert.Equal(Scenario.PositionsCsv, LoadScenario.Generate(120, 7).PositionsCsv);
        Assert.NotEqual(Scenario.PositionsCsv, LoadScenario.Generate(120, 8).PositionsCsv);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(100_001)]
    public void A_book_count_out_of_range_is_refused(int books) =>
        Assert.Contains("books", Assert.Throws<ArgumentOutOfRangeException>(() => LoadScenario.Generate(books, 1)).Message, StringComparison.Ordinal);
}
