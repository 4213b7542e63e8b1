using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Risk;

/// <summary>
/// Reference computation of <see cref="FactorExposures"/> for one list of cash flows, flow by flow.
/// The book path (<see cref="CurveGrid"/>, <see cref="BookRiskCalculator"/>) must agree with it.
/// </summary>
public static class PositionRisk
{
    /// <summary>Most factors one curve may have here (Svensson: 4).</summary>
    internal const int MaxFactorsPerCurve = 4;

    /// <summary>Most factors of base plus spread curve together.</summary>
    internal const int MaxFactors = 2 * MaxFactorsPerCurve;

    /// <summary>
    /// Exposures of <paramref name="flows"/> (amounts in money, or per 100 face with scale = face / 100)
    /// valued at <paramref name="valuationDate"/>, discounted at z_base(t) + s(t), t = ACT/365F years
    /// (<see cref="CurveTime.YearsBetween"/>). Flows with t &lt;= 0 are ignored (already paid).
    /// </summary>
    /// <param name="flows">Dated cash flows.</param>
    /// <param name="valuationDate">Date the curves are measured from.</param>
    /// <param name="baseCurve">Base (government) curve.</param>
    /// <param name="spreadCurve">Spread curve of the bond's spread group, or null for a government bond.</param>
    /// <param name="scale">Multiplier on every amount (face / 100 for per-100 flows; negative for a short).</param>
    public static FactorExposures Compute(
        IReadOnlyList<CashFlow> flows, DateOnly valuationDate, IFactorCurve baseCurve, IFactorCurve? spreadCurve = null, double scale = 1.0)
    {
        ArgumentNullException.ThrowIfNull(flows);
        ArgumentNullException.ThrowIfNull(baseCurve);
        if (!double.IsFinite(scale))
        {
            throw new ArgumentOutOfRangeException(nameof(scale), scale, "Scale must be a finite number.");
        }
        var nb = CheckedFactorCount(baseCurve, nameof(baseCurve));
        var ns = spreadCurve is null ? 0 : CheckedFactorCount(spreadCurve, nameof(spreadCurve));
        var n = nb + ns;
        Span<double> loadings = stackalloc double[n];
        Span<double> row = stackalloc double[MomentLayout.Width(n)];
        row.Clear();
        for (var i = 0; i < flows.Count; i++)
        {
            var flow = flows[i];
            if (!double.IsFinite(flow.Amount))
            {
                throw new ArgumentException(
                    string.Create(CultureInfo.InvariantCulture, $"Cash flow {i} on {flow.Date:yyyy-MM-dd} has a non-finite amount {flow.Amount}."), nameof(flows));
            }
            var t = CurveTime.YearsBetween(valuationDate, flow.Date);
            if (t <= 0)
            {
                continue;
            }
            baseCurve.Loadings(t, loadings[..nb]);
            var z = baseCurve.ZeroRate(t);
            if (spreadCurve is not null)
            {
                spreadCurve.Loadings(t, loadings[nb..]);
                z += spreadCurve.ZeroRate(t);
            }
            MomentLayout.AddCashFlow(flow.Amount * scale, t, Math.Exp(-z * t), loadings, row);
        }
        return new FactorExposures(nb, ns, row);
    }

    internal static int CheckedFactorCount(IFactorCurve curve, string name)
    {
        var n = curve.FactorCount;
        if (n < 1 || n > MaxFactorsPerCurve)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"Curve '{name}' has {n} factors; 1 to {MaxFactorsPerCurve} are supported."), name);
        }
        return n;
    }
}
