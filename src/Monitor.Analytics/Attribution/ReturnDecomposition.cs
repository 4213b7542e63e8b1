using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Attribution;

/// <summary>
/// Holding-period return decomposition (P&amp;L explain) of cash flows or a book between two market states
/// (domain primer, "Holding-period return decomposition"; factor terms from the durations of
/// <see cref="FactorExposures"/>, after Nelson and Siegel 1987 and Diebold and Li 2006).
/// </summary>
/// <remarks>
/// <para>Curves are held as functions of time to payment: Vh values the flows at t1 on the t0 curves measured from
/// t1, so it holds carry and roll-down (the return known at t0 if the curves keep their shape).</para>
/// <para>Cash flows: flows dated on or before t0 are ignored (paid before the period). Flows dated in (t0, t1] count
/// as cash received, at face and without reinvestment interest, in Vh, Vb, Vs and V1, so the horizon return carries
/// the coupon and the curve returns see only flows still outstanding; a flow on t1 itself is cash.</para>
/// <para>Decay (tau) changes are not a factor: each curve move is split into the beta move, explained by factor
/// durations and convexities at the horizon state, and a "shape" term from revaluing with new betas and old decays
/// against new betas and new decays. The residual is then only the Taylor remainder.</para>
/// </remarks>
public static class ReturnDecomposition
{
    /// <summary>Decomposes the return of <paramref name="flows"/> (money, or per 100 face) from t0 to t1.</summary>
    /// <param name="flows">Dated cash flows.</param>
    /// <param name="t0">Start date; the t0 curves are measured from it.</param>
    /// <param name="t1">End date (on or after t0); the t1 curves are measured from it.</param>
    /// <param name="base0">Base curve at t0.</param>
    /// <param name="base1">Base curve at t1 (same model as <paramref name="base0"/>).</param>
    /// <param name="spread0">Spread curve at t0, or null for a government bond.</param>
    /// <param name="spread1">Spread curve at t1; given exactly when <paramref name="spread0"/> is.</param>
    public static ReturnDecompositionResult Decompose(
        IReadOnlyList<CashFlow> flows, DateOnly t0, DateOnly t1,
        IFactorCurve base0, IFactorCurve base1, IFactorCurve? spread0 = null, IFactorCurve? spread1 = null)
    {
        ArgumentNullException.ThrowIfNull(flows);
        if ((spread0 is null) != (spread1 is null))
        {
            throw new ArgumentException("Give both spread curves (t0 and t1) or neither.", spread0 is null ? nameof(spread0) : nameof(spread1));
        }
        return Run([new Segment("spread", flows, spread0, spread1)], t0, t1, base0, base1);
    }

    /// <summary>
    /// Decomposes a book's return: its ledger's flows per curve key, each spread group on its own pair of spread
    /// curves. Spread terms of the groups are added by factor name.
    /// </summary>
    public static ReturnDecompositionResult Decompose(
        BookCashFlowLedger ledger, DateOnly t0, DateOnly t1, IFactorCurve base0, IFactorCurve base1,
        IReadOnlyDictionary<string, IFactorCurve>? spreads0 = null, IReadOnlyDictionary<string, IFactorCurve>? spreads1 = null)
    {
        ArgumentNullException.ThrowIfNull(ledger);
        var segments = new List<Segment>();
        foreach (var key in ledger.CurveKeys)
        {
            var flows = ledger.CashFlows(key);
            if (CurveKey.IsGovernment(key))
            {
                segments.Add(new Segment(key, flows, null, null));
                continue;
            }
            segments.Add(new Segment(key, flows, SpreadFor(spreads0, key, nameof(spreads0)), SpreadFor(spreads1, key, nameof(spreads1))));
        }
        return Run(segments, t0, t1, base0, base1);
    }

    private static ReturnDecompositionResult Run(IReadOnlyList<Segment> segments, DateOnly t0, DateOnly t1, IFactorCurve base0, IFactorCurve base1)
    {
        ArgumentNullException.ThrowIfNull(base0);
        ArgumentNullException.ThrowIfNull(base1);
        if (t1 < t0)
        {
            throw new ArgumentOutOfRangeException(nameof(t1), t1, string.Create(CultureInfo.InvariantCulture, $"End date {t1:yyyy-MM-dd} is before start date {t0:yyyy-MM-dd}."));
        }
        FactorCurveParameters.SameModel(base0, base1, nameof(base1));
        var baseMoves = Moves(base0, base1, nameof(base1));
        var baseBetaOnly = FactorCurveParameters.WithBetas(base0, FactorCurveParameters.Betas(base1, nameof(base1)), nameof(base0));

        double v0 = 0, vh = 0, vb = 0, vs = 0, v1 = 0, cash = 0, baseBetaValue = 0, spreadBetaValue = 0;
        var baseTerms = new TermSums();
        var spreadTerms = new TermSums();
        double[]? firstSpreadMoves = null;
        foreach (var s in segments)
        {
            foreach (var f in s.Flows)
            {
                if (f.Date > t0 && f.Date <= t1)
                {
                    cash += f.Amount;
                }
            }
            v0 += PresentValue(s.Flows, t0, base0, s.Spread0);
            vh += PresentValue(s.Flows, t1, base0, s.Spread0);
            vb += PresentValue(s.Flows, t1, base1, s.Spread0);
            baseBetaValue += PresentValue(s.Flows, t1, baseBetaOnly, s.Spread0);

            var horizon = PositionRisk.Compute(s.Flows, t1, base0, s.Spread0);
            AddTerms(baseTerms, "base", base0.FactorNames, baseMoves, horizon.BaseMoneyDuration, horizon.BaseMoneyConvexity);

            if (s.Spread0 is null || s.Spread1 is null)
            {
                var same = PresentValue(s.Flows, t1, base0, null);
                vs += same;
                v1 += PresentValue(s.Flows, t1, base1, null);
                spreadBetaValue += same;
                continue;
            }
            vs += PresentValue(s.Flows, t1, base0, s.Spread1);
            v1 += PresentValue(s.Flows, t1, base1, s.Spread1);
            FactorCurveParameters.SameModel(s.Spread0, s.Spread1, $"spread[{s.Key}]");
            var spreadMoves = Moves(s.Spread0, s.Spread1, $"spread[{s.Key}]");
            firstSpreadMoves ??= spreadMoves;
            var spreadBetaOnly = FactorCurveParameters.WithBetas(
                s.Spread0, FactorCurveParameters.Betas(s.Spread1, $"spread[{s.Key}]"), $"spread[{s.Key}]");
            spreadBetaValue += PresentValue(s.Flows, t1, base0, spreadBetaOnly);
            AddTerms(spreadTerms, "spread", s.Spread0.FactorNames, spreadMoves, horizon.SpreadMoneyDuration, horizon.SpreadMoneyConvexity);
        }
        vh += cash;
        vb += cash;
        vs += cash;
        v1 += cash;
        baseBetaValue += cash;
        spreadBetaValue += cash;

        var baseExplanation = new CurveReturnExplanation("base", vh, vb - vh, baseMoves, baseTerms.ToList(vh), vb - baseBetaValue);
        var spreadExplanation = firstSpreadMoves is null
            ? null
            : new CurveReturnExplanation("spread", vh, vs - vh, firstSpreadMoves, spreadTerms.ToList(vh), vs - spreadBetaValue);
        return new ReturnDecompositionResult(v0, vh, vb, vs, v1, cash, baseExplanation, spreadExplanation);
    }

    // -sum M1_k d_k, + 1/2 sum M2_kk d_k^2, + sum_{j<k} M2_jk d_j d_k, in money (M = money moments at the horizon).
    private static void AddTerms(
        TermSums sums, string curve, IReadOnlyList<string> names, double[] moves, Func<int, double> moneyDuration, Func<int, int, double> moneyConvexity)
    {
        var n = moves.Length;
        for (var k = 0; k < n; k++)
        {
            sums.Add($"{curve} {names[k]} duration", -moneyDuration(k) * moves[k]);
        }
        for (var k = 0; k < n; k++)
        {
            sums.Add($"{curve} {names[k]} convexity", 0.5 * moneyConvexity(k, k) * moves[k] * moves[k]);
        }
        for (var j = 0; j < n; j++)
        {
            for (var k = j + 1; k < n; k++)
            {
                sums.Add($"{curve} {names[j]} x {names[k]}", moneyConvexity(j, k) * moves[j] * moves[k]);
            }
        }
    }

    private static double[] Moves(IFactorCurve before, IFactorCurve after, string name)
    {
        var b0 = FactorCurveParameters.Betas(before, name);
        var b1 = FactorCurveParameters.Betas(after, name);
        return [.. b1.Select((b, k) => b - b0[k])];
    }

    // sum c exp(-(z_b + s) t) over flows after the valuation date, t = ACT/365F years from it.
    private static double PresentValue(IReadOnlyList<CashFlow> flows, DateOnly valuationDate, IFactorCurve baseCurve, IFactorCurve? spread)
    {
        var value = 0.0;
        foreach (var f in flows)
        {
            var t = CurveTime.YearsBetween(valuationDate, f.Date);
            if (t > 0)
            {
                var z = baseCurve.ZeroRate(t) + (spread?.ZeroRate(t) ?? 0.0);
                value += f.Amount * Math.Exp(-z * t);
            }
        }
        return value;
    }

    private static IFactorCurve SpreadFor(IReadOnlyDictionary<string, IFactorCurve>? spreads, string key, string name) =>
        spreads is not null && spreads.TryGetValue(key, out var curve)
            ? curve
            : throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"No spread curve for spread group '{key}' in '{name}'."), name);

    private sealed record Segment(string Key, IReadOnlyList<CashFlow> Flows, IFactorCurve? Spread0, IFactorCurve? Spread1);

    // Money terms added by name, in order of first appearance.
    private sealed class TermSums
    {
        private readonly List<string> _names = [];
        private readonly Dictionary<string, double> _money = new(StringComparer.Ordinal);

        public void Add(string name, double money)
        {
            if (_money.TryGetValue(name, out var sum))
            {
                _money[name] = sum + money;
            }
            else
            {
                _names.Add(name);
                _money.Add(name, money);
            }
        }

        public IReadOnlyList<ReturnContribution> ToList(double horizonValue) =>
            [.. _names.Select(n => new ReturnContribution(n, _money[n], _money[n] / horizonValue))];
    }
}
