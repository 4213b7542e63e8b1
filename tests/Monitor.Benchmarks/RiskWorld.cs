using Monitor.Analytics.Curves;
using Monitor.Analytics.Risk;

namespace Monitor.Benchmarks;

/// <summary>
/// 1,000 books holding positions in 300 government and 2,700 credit bonds (nine spread groups), in the three forms
/// the benchmarks compare: instrument table + book holdings (the fast path), date-merged ledgers (the first design)
/// and the plain position list. Curve changes alternate between two base curves 1 bp apart.
/// </summary>
internal sealed class RiskWorld
{
    public const int GovernmentBonds = 300;
    public const int CreditBonds = 2_700;

    public RiskWorld(int books, int positions, bool withLedgers)
    {
        Market = new SyntheticMarket(GovernmentBonds, CreditBonds);
        Positions = SyntheticMarket.Positions(Market.Bonds.Count, books, positions);
        Dates = new CashFlowDateIndex();
        Table = new InstrumentCashFlowTable(Dates);
        foreach (var bond in Market.Bonds)
        {
            Table.Register(bond.SpreadGroup, bond.Flows);
        }
        Holdings = [.. Enumerable.Range(0, books).Select(_ => new BookHoldings())];
        foreach (var p in Positions)
        {
            Holdings[p.Book].Add(p.Bond, p.Quantity);
        }
        if (withLedgers)
        {
            Ledgers = [.. Enumerable.Range(0, books).Select(_ => new BookCashFlowLedger(Dates))];
            foreach (var p in Positions)
            {
                var bond = Market.Bonds[p.Bond];
                Ledgers[p.Book].Add(bond.SpreadGroup, bond.Flows, p.Quantity);
            }
        }
        Spreads = Market.SpreadCurves;
    }

    public SyntheticMarket Market { get; }

    public Position[] Positions { get; }

    public CashFlowDateIndex Dates { get; }

    public InstrumentCashFlowTable Table { get; }

    public List<BookHoldings> Holdings { get; }

    public List<BookCashFlowLedger> Ledgers { get; } = [];

    public Dictionary<string, IFactorCurve> Spreads { get; }

    public IFactorCurve[] BaseCurves { get; } =
    [
        SyntheticMarket.TrueBase,
        new NelsonSiegelCurve(SyntheticMarket.TrueBase.Beta0 + 1e-4, SyntheticMarket.TrueBase.Beta1, SyntheticMarket.TrueBase.Beta2, SyntheticMarket.TrueBase.Tau),
    ];

    public CurveGrid Grid(int turn, RiskDepth depth) =>
        CurveGrid.Build(Dates, SyntheticMarket.ValuationDate, BaseCurves[turn & 1], Spreads, depth);

    /// <summary>The grid the holdings path needs: only (key, date) pairs some instrument uses.</summary>
    public CurveGrid InstrumentGrid(int turn) =>
        CurveGrid.BuildForInstruments(Table, SyntheticMarket.ValuationDate, BaseCurves[turn & 1], Spreads, RiskDepth.Durations);
}
