using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Pricing;

/// <summary>
/// Prices cash flows on a zero curve: PV = sum c_j DF(t_j), t_j = CurveTime.YearsBetween(valuationDate, date_j)
/// (ACT/365F years). Amounts per 100 face. Effective duration/convexity by parallel curve shifts.
/// </summary>
public static class CurvePricing
{
    /// <summary>Default shift for effective measures: 1 bp.</summary>
    public const double DefaultShift = 1e-4;

    /// <summary>Value at <paramref name="valuationDate"/> of the flows paid strictly after it.</summary>
    public static double PresentValue(IReadOnlyList<CashFlow> flows, IZeroCurve curve, DateOnly valuationDate)
    {
        ArgumentNullException.ThrowIfNull(flows);
        ArgumentNullException.ThrowIfNull(curve);
        double pv = 0;
        foreach (var flow in flows)
        {
            if (flow.Date > valuationDate)
            {
                pv += flow.Amount * curve.Discount(CurveTime.YearsBetween(valuationDate, flow.Date));
            }
        }

        return pv;
    }

    /// <summary>Value of <paramref name="amounts"/> paid at curve times <paramref name="times"/> (years); t &lt;= 0 is skipped.</summary>
    public static double PresentValue(IReadOnlyList<double> times, IReadOnlyList<double> amounts, IZeroCurve curve)
    {
        ArgumentNullException.ThrowIfNull(times);
        ArgumentNullException.ThrowIfNull(amounts);
        ArgumentNullException.ThrowIfNull(curve);
        if (times.Count != amounts.Count)
        {
            throw new ArgumentException($"times and amounts must have the same length; times.Count = {times.Count}, amounts.Count = {amounts.Count}.", nameof(amounts));
        }

        double pv = 0;
        for (var j = 0; j < times.Count; j++)
        {
            if (times[j] > 0)
            {
                pv += amounts[j] * curve.Discount(times[j]);
            }
        }

        return pv;
    }

    /// <summary>
    /// Dirty price per 100 face for settlement on <paramref name="settlement"/>: the flows after settlement, valued
    /// on the curve of <paramref name="valuationDate"/> and carried forward to settlement, PV / DF(t_settlement).
    /// </summary>
    public static double DirtyPrice(Bond bond, IZeroCurve curve, DateOnly valuationDate, DateOnly settlement)
    {
        ArgumentNullException.ThrowIfNull(bond);
        ArgumentNullException.ThrowIfNull(curve);
        if (settlement < valuationDate)
        {
            throw new ArgumentOutOfRangeException(nameof(settlement), settlement, $"settlement {settlement:yyyy-MM-dd} must not precede valuationDate {valuationDate:yyyy-MM-dd}.");
        }

        var flows = bond.CashFlowsAfter(settlement);
        return PresentValue(flows, curve, valuationDate) / curve.Discount(CurveTime.YearsBetween(valuationDate, settlement));
    }

    /// <summary>Effective duration and convexity of a bond's dirty price by parallel shifts of +/- <paramref name="shift"/>.</summary>
    public static EffectiveRisk Effective(Bond bond, IZeroCurve curve, DateOnly valuationDate, DateOnly settlement, double shift = DefaultShift) =>
        EffectiveOf(c => DirtyPrice(bond, c, valuationDate, settlement), curve, shift);

    /// <summary>Effective duration and convexity of the present value of <paramref name="flows"/>.</summary>
    public static EffectiveRisk Effective(IReadOnlyList<CashFlow> flows, IZeroCurve curve, DateOnly valuationDate, double shift = DefaultShift) =>
        EffectiveOf(c => PresentValue(flows, c, valuationDate), curve, shift);

    /// <summary>Effective duration and convexity of amounts paid at curve times (years).</summary>
    public static EffectiveRisk Effective(IReadOnlyList<double> times, IReadOnlyList<double> amounts, IZeroCurve curve, double shift = DefaultShift) =>
        EffectiveOf(c => PresentValue(times, amounts, c), curve, shift);

    private static EffectiveRisk EffectiveOf(Func<IZeroCurve, double> price, IZeroCurve curve, double shift)
    {
        ArgumentNullException.ThrowIfNull(curve);
        if (!double.IsFinite(shift) || shift <= 0 || shift > 0.01)
        {
            throw new ArgumentOutOfRangeException(nameof(shift), shift, $"shift = {shift} must be in (0, 0.01] (decimal rate, 0.0001 = 1 bp).");
        }

        var p = price(curve);
        if (!(p > 0))
        {
            throw new ArgumentException($"Effective measures need a positive price; price = {p}.", nameof(curve));
        }

        var down = price(new ParallelShiftedCurve(curve, -shift));
        var up = price(new ParallelShiftedCurve(curve, shift));
        return new EffectiveRisk(p, (down - up) / (2 * p * shift), (down + up - (2 * p)) / (p * shift * shift), shift);
    }
}
