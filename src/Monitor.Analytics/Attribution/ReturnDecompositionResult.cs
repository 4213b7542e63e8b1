namespace Monitor.Analytics.Attribution;

/// <summary>
/// Holding-period return of a set of cash flows between two market states, split as in the domain primer
/// ("Holding-period return decomposition"):
/// <c>ln(V1/V0) = ln(Vh/V0) + ln(Vb/Vh) + ln(Vs/Vh) + ln(V1 Vh / (Vb Vs))</c> (horizon, base curve, spread,
/// interaction), an exact identity. Values are in money and include cash received in (t0, t1] at face
/// (see <see cref="ReturnDecomposition"/>). Log returns are NaN when two values differ in sign or one is zero
/// (a hedged book): the money P&amp;L terms, which also add up exactly, remain.
/// </summary>
public sealed class ReturnDecompositionResult
{
    internal ReturnDecompositionResult(
        double v0, double vh, double vb, double vs, double v1, double receivedCash,
        CurveReturnExplanation baseExplanation, CurveReturnExplanation? spreadExplanation)
    {
        V0 = v0;
        Vh = vh;
        Vb = vb;
        Vs = vs;
        V1 = v1;
        ReceivedCash = receivedCash;
        BaseExplanation = baseExplanation;
        SpreadExplanation = spreadExplanation;
        Contributions =
        [
            new("horizon", vh - v0, LogRatio(vh, v0)),
            new("base curve", vb - vh, LogRatio(vb, vh)),
            new("spread", vs - vh, LogRatio(vs, vh)),
            new("interaction", v1 - vb - vs + vh, LogRatio(v1, vb) - LogRatio(vs, vh)),
        ];
    }

    /// <summary>Value at t0 on the t0 curves.</summary>
    public double V0 { get; }

    /// <summary>Value at t1 on the t0 curves (time passed only: carry and roll-down), plus received cash.</summary>
    public double Vh { get; }

    /// <summary>Value at t1 with the t1 base curve and the t0 spread curves, plus received cash.</summary>
    public double Vb { get; }

    /// <summary>Value at t1 with the t0 base curve and the t1 spread curves, plus received cash.</summary>
    public double Vs { get; }

    /// <summary>Value at t1 on the t1 curves, plus received cash.</summary>
    public double V1 { get; }

    /// <summary>Cash flows dated in (t0, t1], counted at face in Vh, Vb, Vs and V1.</summary>
    public double ReceivedCash { get; }

    /// <summary>
    /// Horizon, base curve, spread and interaction, in that order: money P&amp;L (adds up to V1 - V0) and
    /// continuous (log) return (adds up to ln(V1/V0)).
    /// </summary>
    public IReadOnlyList<ReturnContribution> Contributions { get; }

    /// <summary>ln(V1 / V0), continuous total return.</summary>
    public double TotalReturn => LogRatio(V1, V0);

    /// <summary>V1 - V0 in money.</summary>
    public double TotalPnl => V1 - V0;

    /// <summary>Factor explanation of the base curve's discrete return (Vb - Vh) / Vh.</summary>
    public CurveReturnExplanation BaseExplanation { get; }

    /// <summary>Factor explanation of the spread curves' discrete return (Vs - Vh) / Vh; null without spread curves.</summary>
    public CurveReturnExplanation? SpreadExplanation { get; }

    // ln(a/b), NaN unless a and b are nonzero and of one sign.
    private static double LogRatio(double a, double b)
    {
        var r = a / b;
        return r > 0 && double.IsFinite(r) ? Math.Log(r) : double.NaN;
    }
}
