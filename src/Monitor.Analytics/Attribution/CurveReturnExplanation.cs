namespace Monitor.Analytics.Attribution;

/// <summary>
/// The discrete return of one curve move (base or spread) at the horizon, (V_moved - Vh) / Vh, explained by factor
/// durations and convexities evaluated at the horizon state (t1, old curves) and the factor moves
/// d = new betas - old betas:
/// <c>-sum D_k d_k + 1/2 sum C_k d_k^2 + sum_{j&lt;k} C_jk d_j d_k</c>,
/// plus a <see cref="Shape"/> term for a change of the decays (tau), found by revaluation:
/// (V(new betas, new taus) - V(new betas, old taus)) / Vh. <see cref="Residual"/> is what is left; without a tau
/// change it is the third-order Taylor remainder.
/// </summary>
public sealed class CurveReturnExplanation
{
    internal CurveReturnExplanation(
        string curve, double horizonValue, double actualMoney, IReadOnlyList<double> factorMoves, IReadOnlyList<ReturnContribution> terms, double shapeMoney)
    {
        Curve = curve;
        FactorMoves = factorMoves;
        Terms = terms;
        Actual = new ReturnContribution($"{curve} actual", actualMoney, actualMoney / horizonValue);
        Shape = new ReturnContribution($"{curve} shape (decay change)", shapeMoney, shapeMoney / horizonValue);
        var explained = terms.Sum(t => t.Money) + shapeMoney;
        var residual = actualMoney - explained;
        Residual = new ReturnContribution($"{curve} residual", residual, residual / horizonValue);
    }

    /// <summary>"base" or "spread".</summary>
    public string Curve { get; }

    /// <summary>The discrete return being explained (money = V_moved - Vh).</summary>
    public ReturnContribution Actual { get; }

    /// <summary>Factor moves new beta - old beta, decimals, in factor order (spread: of the first spread group).</summary>
    public IReadOnlyList<double> FactorMoves { get; }

    /// <summary>Duration terms, then convexity terms, then cross-convexity terms (j &lt; k), each named.</summary>
    public IReadOnlyList<ReturnContribution> Terms { get; }

    /// <summary>Effect of the decay (tau) change, by revaluation; zero when the decays are unchanged.</summary>
    public ReturnContribution Shape { get; }

    /// <summary>Actual minus the terms and the shape effect.</summary>
    public ReturnContribution Residual { get; }
}
