using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Benchmarks;

/// <summary>
/// An invented market drawn from a fixed seed (no real data): government bonds paying semiannual coupons on the
/// 15th or the last day of a month, credit bonds in nine spread groups paying on any day of the year (which is what
/// spreads cash-flow dates over the calendar), and books of positions in them. Valuation date 2026-03-16.
/// </summary>
internal sealed class SyntheticMarket
{
    public static readonly DateOnly ValuationDate = new(2026, 3, 16);

    public static readonly NelsonSiegelCurve TrueBase = new(0.042, -0.018, 0.012, 2.2);

    public static readonly string[] SpreadGroups = [.. Enumerable.Range(1, 9).Select(i => $"group-{i}")];

    public SyntheticMarket(int governmentBonds, int creditBonds, int seed = 20260316)
    {
        var rng = new Random(seed);
        for (var i = 0; i < governmentBonds; i++)
        {
            Bonds.Add(GovernmentBond(rng, i));
        }
        for (var i = 0; i < creditBonds; i++)
        {
            Bonds.Add(CreditBond(rng, i));
        }
        SpreadCurves = SpreadGroups.ToDictionary(
            g => g, g => (IFactorCurve)new NelsonSiegelCurve(0.004 + 0.002 * rng.NextDouble() * 4, -0.002 * rng.NextDouble(), 0.003 * rng.NextDouble(), 1.0 + 2 * rng.NextDouble()));
    }

    /// <summary>Universe of bonds: per 100 face cash flows after the valuation date, and the spread group (null = government).</summary>
    public List<SyntheticBond> Bonds { get; } = [];

    public Dictionary<string, IFactorCurve> SpreadCurves { get; }

    /// <summary>Same spread curves with every level moved by <paramref name="bp"/> (a curve change for the benchmarks).</summary>
    public Dictionary<string, IFactorCurve> ShiftedSpreads(double bp) =>
        SpreadCurves.ToDictionary(p => p.Key, p =>
        {
            var c = (NelsonSiegelCurve)p.Value;
            return (IFactorCurve)new NelsonSiegelCurve(c.Beta0 + bp * 1e-4, c.Beta1, c.Beta2, c.Tau);
        });

    /// <summary>Positions: book number, bond number, quantity (face / 100), drawn uniformly over the universe.</summary>
    public static Position[] Positions(int bondCount, int books, int positions, int seed = 7)
    {
        var rng = new Random(seed);
        var result = new Position[positions];
        for (var p = 0; p < positions; p++)
        {
            result[p] = new Position(p % books, rng.Next(bondCount), (rng.Next(1, 200) - 60) * 10_000.0);
        }
        return result;
    }

    /// <summary>Fit instruments of the government bonds priced exactly on <paramref name="curve"/> (dirty prices).</summary>
    public List<FitInstrument> FitInstruments(IZeroCurve curve, double yieldShiftBp = 0)
    {
        var list = new List<FitInstrument>();
        foreach (var b in Bonds.Where(b => b.SpreadGroup is null))
        {
            double pv = 0, tpv = 0;
            for (var j = 0; j < b.Times.Length; j++)
            {
                var v = b.Amounts[j] * curve.Discount(b.Times[j]);
                pv += v;
                tpv += b.Times[j] * v;
            }
            var duration = tpv / pv;
            list.Add(new FitInstrument(b.Id, b.Times, b.Amounts, pv * (1 - duration * yieldShiftBp * 1e-4), duration));
        }
        return list;
    }

    private static SyntheticBond GovernmentBond(Random rng, int i)
    {
        // Maturity on the 15th or the last day of a month within 30 years; coupon 0-7% in eighths.
        var maturity = ValuationDate.AddMonths(rng.Next(3, 360));
        maturity = rng.Next(2) == 0 ? new DateOnly(maturity.Year, maturity.Month, 15) : new DateOnly(maturity.Year, maturity.Month, DateTime.DaysInMonth(maturity.Year, maturity.Month));
        var coupon = Math.Round(rng.NextDouble() * 7.0 * 8) / 8 / 100;
        return Build($"GOV{i:D4}", null, maturity, coupon, 2);
    }

    private static SyntheticBond CreditBond(Random rng, int i)
    {
        var maturity = ValuationDate.AddDays(rng.Next(60, 30 * 365));
        var coupon = Math.Round((1.0 + rng.NextDouble() * 7.0) * 8) / 8 / 100;
        return Build($"CRD{i:D4}", SpreadGroups[rng.Next(SpreadGroups.Length)], maturity, coupon, rng.Next(3) == 0 ? 1 : 2);
    }

    private static SyntheticBond Build(string id, string? group, DateOnly maturity, double coupon, int frequency)
    {
        // Regular coupons stepping back from maturity (end-of-month kept), issued on a coupon date before valuation.
        var months = 12 / frequency;
        var endOfMonth = maturity.Day == DateTime.DaysInMonth(maturity.Year, maturity.Month);
        var dates = new List<DateOnly>();
        for (var k = 0; ; k++)
        {
            var d = maturity.AddMonths(-k * months);
            if (endOfMonth)
            {
                d = new DateOnly(d.Year, d.Month, DateTime.DaysInMonth(d.Year, d.Month));
            }
            if (d <= ValuationDate)
            {
                dates.Reverse();
                var flows = dates.Select((x, j) => new CashFlow(x, 100.0 * coupon / frequency + (j == dates.Count - 1 ? 100.0 : 0.0))).ToArray();
                return new SyntheticBond(id, group, coupon, frequency, d, maturity, flows);
            }
            dates.Add(d);
        }
    }
}

/// <summary>An invented bond: remaining flows per 100 face (dates and curve times), coupon and schedule facts for QLNet.</summary>
internal sealed class SyntheticBond
{
    public SyntheticBond(string id, string? spreadGroup, double coupon, int frequency, DateOnly issue, DateOnly maturity, CashFlow[] flows)
    {
        Id = id;
        SpreadGroup = spreadGroup;
        Coupon = coupon;
        Frequency = frequency;
        Issue = issue;
        Maturity = maturity;
        Flows = flows;
        Times = [.. flows.Select(f => CurveTime.YearsBetween(SyntheticMarket.ValuationDate, f.Date))];
        Amounts = [.. flows.Select(f => f.Amount)];
    }

    public string Id { get; }

    public string? SpreadGroup { get; }

    public double Coupon { get; }

    public int Frequency { get; }

    /// <summary>Last coupon date on or before the valuation date (the schedule's start).</summary>
    public DateOnly Issue { get; }

    public DateOnly Maturity { get; }

    public CashFlow[] Flows { get; }

    public double[] Times { get; }

    public double[] Amounts { get; }
}

internal readonly record struct Position(int Book, int Bond, double Quantity);
