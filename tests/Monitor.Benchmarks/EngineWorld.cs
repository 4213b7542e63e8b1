using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Limits;
using Monitor.Service.Engine;

namespace Monitor.Benchmarks;

/// <summary>
/// The service's <see cref="RiskEngine"/> on the benchmarks' invented universe (<see cref="SyntheticMarket"/>: 300
/// government and 2,700 credit bonds in nine spread groups, as reference data), books BOOK-0000... in ten desks with a
/// DV01 limit each, positions loaded from <see cref="SyntheticMarket.Positions"/>. The government curve is fitted from
/// par yields of the true base curve and each spread curve from 12 of its bonds priced on the true curves, so a call of
/// <see cref="RefitGovernment"/> is what a new government curve costs the service: fits, then every book revalued.
/// </summary>
internal sealed class EngineWorld
{
    public static readonly DateTimeOffset Now = new(2026, 3, 16, 16, 0, 0, TimeSpan.Zero);
    private static readonly double[] TenorYears = [1, 2, 3, 5, 7, 10, 15, 20, 30];

    public EngineWorld(int books, int positions)
    {
        var market = new SyntheticMarket(RiskWorld.GovernmentBonds, RiskWorld.CreditBonds);
        var bookIds = Enumerable.Range(0, books).Select(b => $"BOOK-{b:D4}").ToArray();
        var desks = bookIds.Chunk(Math.Max(1, books / 10)).Select((ids, d) => (Desk: $"DESK-{d}", Books: (IReadOnlyList<string>)ids))
            .ToDictionary(d => d.Desk, d => d.Books, StringComparer.Ordinal);
        var limits = bookIds.Select(b => new LimitDefinition
        {
            Id = b + "-dv01", Scope = LimitScope.Book(b), Measure = ExposureMeasure.Dv01, Lower = -1e9, Upper = 1e9,
        }).ToArray();
        Engine = new RiskEngine(new EngineSettings { ValuationDate = SyntheticMarket.ValuationDate, ValuationCurveSource = ValuationCurveSource.ParYields },
            new LimitsConfiguration(new BookHierarchy("bench-firm", desks), limits));
        var bonds = market.Bonds.Select(ToBond).ToArray();
        foreach (var bond in bonds)
        {
            Engine.DefineInstrument(bond);
        }
        foreach (var p in SyntheticMarket.Positions(bonds.Length, books, positions).Where(p => p.Quantity != 0)) // the engine refuses a face of 0
        {
            Engine.LoadPosition(bookIds[p.Book], bonds[p.Bond].Id, p.Quantity * 100);
        }
        foreach (var group in SyntheticMarket.SpreadGroups)
        {
            foreach (var bond in bonds.Where(b => b.SpreadGroup == group).Take(12))
            {
                Engine.AcceptQuote(new BondQuote(bond.Id, Now.AddMinutes(-1), null, null, CleanPrice(bond, market.SpreadCurves[group]), null, "bench"), Now);
            }
        }
        ParYields = [ParYieldsOf(SyntheticMarket.TrueBase), ParYieldsOf(new NelsonSiegelCurve(
            SyntheticMarket.TrueBase.Beta0 + 1e-4, SyntheticMarket.TrueBase.Beta1, SyntheticMarket.TrueBase.Beta2, SyntheticMarket.TrueBase.Tau))];
        var first = RefitGovernment(0);
        if (first.Books.Count != books || first.Curves.Any(c => !c.Accepted))
        {
            throw new InvalidOperationException(
                $"Engine world: {first.Books.Count} of {books} books valued; rejected fits: {string.Join("; ", first.Curves.Where(c => !c.Accepted).Select(c => c.CurveKey + " " + string.Join(", ", c.Verdict.Reasons)))}.");
        }
        BookIds = bookIds;
    }

    public RiskEngine Engine { get; }

    public string[] BookIds { get; }

    /// <summary>Two par-yield sets, of the true base curve and of it 1 bp higher: alternate them for a new curve each time.</summary>
    public (string Tenor, double ParYield)[][] ParYields { get; }

    public EngineResult RefitGovernment(int turn) =>
        Engine.ApplyParYields(CurveKeyLabel.Government, Now.AddMinutes(-1), ParYields[turn & 1], Now);

    // Semiannual par yield at T: 2 (1 - DF(T)) / sum of DF at the coupon dates (bond-equivalent, as the par-yield fit reads it).
    internal static (string Tenor, double ParYield)[] ParYieldsOf(IZeroCurve curve) =>
        [.. TenorYears.Select(years =>
        {
            var annuity = 0.0;
            for (var i = 1; i <= 2 * years; i++)
            {
                annuity += curve.Discount(i / 2.0);
            }
            return (years.ToString(CultureInfo.InvariantCulture) + "Y", 2 * (1 - curve.Discount(years)) / annuity);
        })];

    private static double CleanPrice(Bond bond, IFactorCurve spread)
    {
        var settlement = BondFitInputs.SettlementDate(bond, SyntheticMarket.ValuationDate);
        var dirty = 0.0;
        foreach (var flow in bond.CashFlowsAfter(settlement))
        {
            var t = CurveTime.YearsBetween(SyntheticMarket.ValuationDate, flow.Date);
            dirty += flow.Amount * Math.Exp(-(SyntheticMarket.TrueBase.ZeroRate(t) + spread.ZeroRate(t)) * t);
        }
        return dirty - bond.AccruedInterest(settlement);
    }

    internal static Bond ToBond(SyntheticBond b) =>
        new(b.Id, "Synthetic Veloria Issuer", b.SpreadGroup, "XTS", (decimal)b.Coupon, b.Frequency, DayCountConvention.ActActIcma, b.Issue, null, b.Maturity);
}
