using Monitor.Analytics.Curves;
using Monitor.Limits;
using Monitor.Service.Engine;

namespace Monitor.Benchmarks;

/// <summary>
/// The shape of <c>monitor load</c> inside the engine: 40 invented government bonds (<see cref="SyntheticMarket"/>), 1,000
/// books of 10 long positions (distinct bonds, 1-20 million face), desks of 50 books, one marketValue limit per book
/// whose opening use sits at 79-83% (warning 80%, band 0.5%, as the load's limits file), a DV01 limit per desk and a
/// marketValue limit on the firm (opening use about 80%). The government curve is fitted from par yields that alternate
/// 1 bp apart, so each <see cref="RefitGovernment"/> is a new curve: one fit, the rows rebuilt, every book revalued.
/// </summary>
internal sealed class SmallBooksWorld
{
    public const int GovernmentBonds = 40;
    public const int PositionsPerBook = 10;
    public const int BooksPerDesk = 50;
    private const string Firm = "small-firm";

    public SmallBooksWorld(int books, int seed = 20261202)
    {
        var market = new SyntheticMarket(GovernmentBonds, 0);
        var random = new Random(seed);
        BookIds = [.. Enumerable.Range(0, books).Select(b => $"SB-{b:D4}")];
        var desks = BookIds.Chunk(BooksPerDesk).Select((ids, d) => (Desk: $"SD-{d:D2}", Books: (IReadOnlyList<string>)ids))
            .ToDictionary(d => d.Desk, d => d.Books, StringComparer.Ordinal);
        var hierarchy = new BookHierarchy(Firm, desks);
        Engine = new RiskEngine(new EngineSettings { ValuationDate = SyntheticMarket.ValuationDate, ValuationCurveSource = ValuationCurveSource.ParYields }, new LimitsConfiguration(hierarchy, []));
        var bonds = market.Bonds.Select(EngineWorld.ToBond).ToArray();
        foreach (var bond in bonds)
        {
            Engine.DefineInstrument(bond);
        }
        foreach (var book in BookIds)
        {
            foreach (var bond in random.GetItems(bonds, PositionsPerBook).DistinctBy(b => b.Id))
            {
                Engine.LoadPosition(book, bond.Id, random.Next(1, 21) * 1_000_000.0);
            }
        }
        ParYields = [EngineWorld.ParYieldsOf(SyntheticMarket.TrueBase), EngineWorld.ParYieldsOf(new NelsonSiegelCurve(
            SyntheticMarket.TrueBase.Beta0 + 1e-4, SyntheticMarket.TrueBase.Beta1, SyntheticMarket.TrueBase.Beta2, SyntheticMarket.TrueBase.Tau))];
        var first = RefitGovernment(0);
        if (first.Books.Count != books || first.Curves.Any(c => !c.Accepted))
        {
            throw new InvalidOperationException($"Small books world: {first.Books.Count} of {books} books valued.");
        }

        // Limits from the opening figures, as monitor load sets them: book use 79-83% of an upper marketValue bound.
        double Figure(string book, ExposureMeasure m) => Engine.Books[book].Exposures!.Totals[m];
        var limits = new List<LimitDefinition>();
        foreach (var book in BookIds)
        {
            limits.Add(new LimitDefinition
            {
                Id = book + "-value", Scope = LimitScope.Book(book), Measure = ExposureMeasure.MarketValue,
                Upper = Math.Round(Figure(book, ExposureMeasure.MarketValue) / (0.79 + 0.04 * random.NextDouble())),
                WarningFraction = 0.8, HysteresisFraction = 0.005,
            });
        }
        foreach (var (desk, members) in desks)
        {
            limits.Add(new LimitDefinition
            {
                Id = desk + "-dv01", Scope = LimitScope.Desk(desk), Measure = ExposureMeasure.Dv01,
                Upper = Math.Round(members.Sum(b => Figure(b, ExposureMeasure.Dv01)) / 0.8), WarningFraction = 0.8, HysteresisFraction = 0.005,
            });
        }
        limits.Add(new LimitDefinition
        {
            Id = "firm-value", Scope = LimitScope.Firm(Firm), Measure = ExposureMeasure.MarketValue,
            Upper = Math.Round(BookIds.Sum(b => Figure(b, ExposureMeasure.MarketValue)) / 0.8), WarningFraction = 0.8, HysteresisFraction = 0.005,
        });
        Engine.ReloadLimits(new LimitsConfiguration(hierarchy, limits), EngineWorld.Now);
        Engine.RevalueAll(EngineWorld.Now);
    }

    public RiskEngine Engine { get; }

    public string[] BookIds { get; }

    /// <summary>Par yields of the true base curve and of it 1 bp higher: alternate them for a new curve each time.</summary>
    public (string Tenor, double ParYield)[][] ParYields { get; }

    public EngineResult RefitGovernment(int turn) =>
        Engine.ApplyParYields(CurveKeyLabel.Government, EngineWorld.Now.AddMinutes(-1), ParYields[turn & 1], EngineWorld.Now);
}
