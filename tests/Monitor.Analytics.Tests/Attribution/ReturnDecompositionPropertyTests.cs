using FsCheck.Xunit;
using Monitor.Analytics.Attribution;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Tests.Risk;

namespace Monitor.Analytics.Tests.Attribution;

/// <summary>Properties of the holding-period return decomposition of the domain primer.</summary>
public class ReturnDecompositionPropertyTests
{
    private sealed record Scenario(
        CashFlow[] Flows, DateOnly T0, DateOnly T1, IFactorCurve Base0, IFactorCurve Base1, IFactorCurve? Spread0, IFactorCurve? Spread1, double SumAbsMoves)
    {
        public ReturnDecompositionResult Run() => ReturnDecomposition.Decompose(Flows, T0, T1, Base0, Base1, Spread0, Spread1);
    }

    // Curves at t0 and t1; betas move by up to 'move' each, decays by up to 'tauMove' (relative).
    private static Scenario Draw(int seed, double move, double tauMove)
    {
        var rng = new Random(seed);
        var svensson = rng.Next(2) == 0;
        var b0 = RiskTestData.BaseParameters(rng, svensson);
        var b1 = Moved(rng, b0, svensson ? 4 : 3, move, tauMove);
        double[]? s0 = rng.Next(2) == 0 ? RiskTestData.SpreadParameters(rng) : null;
        var s1 = s0 is null ? null : Moved(rng, s0, 3, move, tauMove);
        var sumAbs = b1.Zip(b0, (x, y) => Math.Abs(x - y)).Take(svensson ? 4 : 3).Sum();
        var t0 = RiskTestData.ValuationDate;
        return new Scenario(RiskTestData.RandomBond(rng), t0, t0.AddDays(rng.Next(0, 45)),
            RiskTestData.Curve(b0), RiskTestData.Curve(b1),
            s0 is null ? null : RiskTestData.Curve(s0), s1 is null ? null : RiskTestData.Curve(s1!), sumAbs);
    }

    private static double[] Moved(Random rng, double[] p, int betas, double move, double tauMove)
    {
        var q = (double[])p.Clone();
        for (var i = 0; i < q.Length; i++)
        {
            q[i] = i < betas ? q[i] + RiskTestData.U(rng, -move, move) : q[i] * (1 + RiskTestData.U(rng, -tauMove, tauMove));
        }
        return q;
    }

    [Property(MaxTest = 80)]
    public void The_four_log_returns_add_up_to_the_total_log_return(int seed)
    {
        // Identity (primer): ln(V1/V0) = ln(Vh/V0) + ln(Vb/Vh) + ln(Vs/Vh) + ln(V1 Vh/(Vb Vs)), exact in real
        // arithmetic; in floating point a few ulps of the logs, so 1e-12 absolute.
        var s = Draw(seed, move: 0.01, tauMove: 0.3);
        var r = s.Run();
        Assert.Equal(r.TotalReturn, r.Contributions.Sum(c => c.Return), 1e-12);
        // Money form of the same identity: V1 - V0 = (Vh - V0) + (Vb - Vh) + (Vs - Vh) + (V1 - Vb - Vs + Vh).
        Assert.Equal(r.TotalPnl, r.Contributions.Sum(c => c.Money), 1e-12 * Math.Abs(r.V0));
        // Each curve explanation adds up to its actual return by construction (residual is the rest).
        foreach (var e in new[] { r.BaseExplanation, r.SpreadExplanation }.OfType<CurveReturnExplanation>())
        {
            Assert.Equal(e.Actual.Money, e.Terms.Sum(t => t.Money) + e.Shape.Money + e.Residual.Money, 1e-12 * Math.Abs(r.Vh));
        }
    }

    [Property(MaxTest = 80)]
    public void With_small_beta_moves_the_residual_is_bounded_by_the_third_order_Taylor_remainder(int seed)
    {
        // Identity: the explained terms are the second-order Taylor expansion of P(b + db) at the horizon state
        // (primer, factor duration and convexity terms). With u = t sum_k L_k db_k, |L_k| <= 1 (Nelson and Siegel
        // 1987 loadings), |u| <= U = t_max sum|db|, and e^-u = 1 - u + u^2/2 + R with |R| <= U^3/6 e^U (Lagrange
        // remainder), so |residual return| <= U^3/6 e^U for a long bond (all flows positive). Decays change too:
        // the shape term takes them out, so the bound still holds. 1e-14 absolute covers rounding of values ~100.
        var s = Draw(seed, move: 2e-4, tauMove: 0.05);
        var r = s.Run();
        var tMax = s.Flows.Max(f => CurveTime.YearsBetween(s.T1, f.Date));
        var u = Math.Max(tMax, 0) * s.SumAbsMoves;
        var bound = u * u * u / 6 * Math.Exp(u) + 1e-14;
        Assert.True(Math.Abs(r.BaseExplanation.Residual.Return) <= bound,
            $"base residual {r.BaseExplanation.Residual.Return:R} above bound {bound:R}; actual {r.BaseExplanation.Actual.Return:R}");
        // Second-order small against the move itself: the residual is far below the first-order (duration) size.
        Assert.True(Math.Abs(r.BaseExplanation.Residual.Return) <= 1e-3 * u + 1e-14);
        if (r.SpreadExplanation is { } spread)
        {
            var spreadMoves = spread.FactorMoves.Sum(Math.Abs);
            var us = Math.Max(tMax, 0) * spreadMoves;
            Assert.True(Math.Abs(spread.Residual.Return) <= us * us * us / 6 * Math.Exp(us) + 1e-14,
                $"spread residual {spread.Residual.Return:R}");
        }
    }
}
