using System.Globalization;

namespace Monitor.Analytics.Risk;

/// <summary>
/// Curve-factor exposures of a position or a book: dirty value, DV01, factor durations, convexities and
/// cross-convexities against the base (government) curve factors and, for credit, the spread curve factors.
/// </summary>
/// <remarks>
/// <para>Formulas (Nelson and Siegel 1987 loadings; Fisher and Weil 1971 duration; Diebold and Li 2006 factors),
/// with c the cash flow in money, t in years (ACT/365F), L_k the factor loading and DF the discount factor:</para>
/// <list type="bullet">
/// <item>factor duration D_k = -(1/P) dP/db_k = sum c t L_k DF / P (years);</item>
/// <item>factor convexity C_k = (1/P) d2P/db_k^2 = sum c t^2 L_k^2 DF / P (years squared);</item>
/// <item>cross-convexity C_jk = (1/P) d2P/db_j db_k = sum c t^2 L_j L_k DF / P.</item>
/// </list>
/// <para>Sign convention: a factor <em>rise</em> is the risk. A long position (positive cash flows) has positive
/// durations and a positive money-per-bp figure, which is the money <em>lost</em> when that factor rises by
/// 1 bp (0.0001): <c>MoneyPerBp_k = D_k * P * 1e-4</c>. A short position has negative money figures; its unit
/// durations stay positive because both numerator and P change sign. <see cref="Dv01"/> is the money
/// <em>gained</em> when the whole zero curve falls 1 bp in parallel, which equals the base level money per bp.</para>
/// <para>The money forms add across positions and books; unit forms are value-weighted and are NaN when
/// <see cref="Value"/> is exactly zero (a fully hedged book): limit money forms there.</para>
/// <para>On a spread curve z_base + s both the base loadings and the spread loadings act on the same discount
/// factors, so a credit bond's spread level duration equals its base level duration. For a government bond the
/// spread figures are zero (<see cref="SpreadFactorCount"/> may then be 0: indices beyond it read as 0).</para>
/// </remarks>
public sealed class FactorExposures
{
    private const double BasisPoint = 1e-4;

    // Money moments: _first[k] = sum c t L_k DF; _second[j*n+k] = sum c t^2 L_j L_k DF, over n = base + spread factors.
    private readonly double[] _first;
    private readonly double[] _second;

    internal FactorExposures(int baseFactorCount, int spreadFactorCount, ReadOnlySpan<double> momentRow)
    {
        BaseFactorCount = baseFactorCount;
        SpreadFactorCount = spreadFactorCount;
        var n = baseFactorCount + spreadFactorCount;
        Value = momentRow[0];
        _first = momentRow.Slice(1, n).ToArray();
        _second = MomentLayout.ExpandSecondMoments(momentRow, n);
    }

    private FactorExposures(int baseFactorCount, int spreadFactorCount, double value, double[] first, double[] second)
    {
        BaseFactorCount = baseFactorCount;
        SpreadFactorCount = spreadFactorCount;
        Value = value;
        _first = first;
        _second = second;
    }

    /// <summary>Number of base curve factors (3 Nelson-Siegel, 4 Svensson).</summary>
    public int BaseFactorCount { get; }

    /// <summary>Number of spread curve factors (0 when discounted on the base curve alone).</summary>
    public int SpreadFactorCount { get; }

    private int FactorCount => BaseFactorCount + SpreadFactorCount;

    /// <summary>Dirty present value in money (cash flows dated after the valuation date only).</summary>
    public double Value { get; }

    /// <summary>
    /// Curve DV01 in money: value gained when the zero curve falls 1 bp in parallel (continuously compounded).
    /// Equals the base level money per bp: a parallel move is a move of the level factor (L_0 = 1).
    /// </summary>
    public double Dv01 => BaseMoneyPerBp(0);

    /// <summary>Exposures of nothing: value and all figures zero.</summary>
    public static FactorExposures Zero(int baseFactorCount, int spreadFactorCount)
    {
        CheckCounts(baseFactorCount, spreadFactorCount);
        var n = baseFactorCount + spreadFactorCount;
        return new FactorExposures(baseFactorCount, spreadFactorCount, 0.0, new double[n], new double[n * n]);
    }

    /// <summary>
    /// Exposures from a row of money moments in the layout of <see cref="MomentLayout"/> (value, first moments, upper
    /// triangle of second moments over base then spread factors), as <see cref="BookRiskMatrix.Moments"/> gives it.
    /// </summary>
    /// <exception cref="ArgumentException">The row is not 1 + n + n(n+1)/2 long for n = base + spread factors.</exception>
    public static FactorExposures FromMoments(int baseFactorCount, int spreadFactorCount, ReadOnlySpan<double> moments)
    {
        CheckCounts(baseFactorCount, spreadFactorCount);
        var width = MomentLayout.Width(baseFactorCount + spreadFactorCount);
        if (moments.Length != width)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"A moment row for {baseFactorCount} + {spreadFactorCount} factors has {width} entries, got {moments.Length}."),
                nameof(moments));
        }
        return new FactorExposures(baseFactorCount, spreadFactorCount, moments);
    }

    /// <summary>Base factor duration D_k in years (unit form, value-weighted).</summary>
    public double BaseDuration(int k) => _first[BaseIndex(k)] / Value;

    /// <summary>Spread factor duration in years (0 beyond <see cref="SpreadFactorCount"/> when the value is nonzero).</summary>
    public double SpreadDuration(int k) => SpreadMoneyDuration(k) / Value;

    /// <summary>Base factor money duration -dP/db_k: money lost per unit (1.00 = 10,000 bp) rise of factor k.</summary>
    public double BaseMoneyDuration(int k) => _first[BaseIndex(k)];

    /// <summary>Spread factor money duration -dP/dg_k in money per unit rise.</summary>
    public double SpreadMoneyDuration(int k) => SpreadIndex(k) is var i && i < 0 ? 0.0 : _first[i];

    /// <summary>Money lost when base factor k rises 1 bp: D_k * P * 1e-4.</summary>
    public double BaseMoneyPerBp(int k) => BaseMoneyDuration(k) * BasisPoint;

    /// <summary>Money lost when spread factor k rises 1 bp.</summary>
    public double SpreadMoneyPerBp(int k) => SpreadMoneyDuration(k) * BasisPoint;

    /// <summary>Base factor convexity C_k = (1/P) d2P/db_k^2, years squared.</summary>
    public double BaseConvexity(int k) => BaseCrossConvexity(k, k);

    /// <summary>Spread factor convexity, years squared.</summary>
    public double SpreadConvexity(int k) => SpreadCrossConvexity(k, k);

    /// <summary>Base cross-convexity C_jk = (1/P) d2P/db_j db_k (symmetric; j = k gives the convexity).</summary>
    public double BaseCrossConvexity(int j, int k) => BaseMoneyConvexity(j, k) / Value;

    /// <summary>Spread cross-convexity (1/P) d2P/dg_j dg_k.</summary>
    public double SpreadCrossConvexity(int j, int k) => SpreadMoneyConvexity(j, k) / Value;

    /// <summary>Mixed base-spread convexity (1/P) d2P/db_j dg_k: part of the interaction of the two moves.</summary>
    public double BaseSpreadCrossConvexity(int baseK, int spreadK) => BaseSpreadMoneyConvexity(baseK, spreadK) / Value;

    /// <summary>Money convexity d2P/db_j db_k.</summary>
    public double BaseMoneyConvexity(int j, int k) => _second[BaseIndex(j) * FactorCount + BaseIndex(k)];

    /// <summary>Money convexity d2P/dg_j dg_k (0 beyond <see cref="SpreadFactorCount"/>).</summary>
    public double SpreadMoneyConvexity(int j, int k)
    {
        var a = SpreadIndex(j);
        var b = SpreadIndex(k);
        return a < 0 || b < 0 ? 0.0 : _second[a * FactorCount + b];
    }

    /// <summary>Money convexity d2P/db_j dg_k (0 beyond <see cref="SpreadFactorCount"/>).</summary>
    public double BaseSpreadMoneyConvexity(int baseK, int spreadK)
    {
        var a = BaseIndex(baseK);
        var b = SpreadIndex(spreadK);
        return b < 0 ? 0.0 : _second[a * FactorCount + b];
    }

    /// <summary>
    /// Sum of two exposures on the same base curve (money forms add; unit forms are re-weighted by value).
    /// Spread factors are added index by index, so summing over spread groups treats all spread curves as moving
    /// together; the result has the larger of the two spread factor counts.
    /// </summary>
    public FactorExposures Plus(FactorExposures other)
    {
        ArgumentNullException.ThrowIfNull(other);
        if (other.BaseFactorCount != BaseFactorCount)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Cannot add exposures with {other.BaseFactorCount} base factors to exposures with {BaseFactorCount}."),
                nameof(other));
        }
        var ns = Math.Max(SpreadFactorCount, other.SpreadFactorCount);
        var n = BaseFactorCount + ns;
        var first = new double[n];
        var second = new double[n * n];
        AddInto(this, first, second, n);
        AddInto(other, first, second, n);
        return new FactorExposures(BaseFactorCount, ns, Value + other.Value, first, second);
    }

    /// <summary>The exposures of <paramref name="factor"/> times the cash flows (a negative factor is a short).</summary>
    public FactorExposures Scale(double factor)
    {
        var first = Array.ConvertAll(_first, x => x * factor);
        var second = Array.ConvertAll(_second, x => x * factor);
        return new FactorExposures(BaseFactorCount, SpreadFactorCount, Value * factor, first, second);
    }

    public override string ToString() =>
        string.Create(CultureInfo.InvariantCulture,
            $"Exposures(value={Value:G8}, dv01={Dv01:G6}, base factors={BaseFactorCount}, spread factors={SpreadFactorCount})");

    internal static void CheckCounts(int baseFactorCount, int spreadFactorCount)
    {
        if (baseFactorCount < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(baseFactorCount), baseFactorCount, "A base curve has at least one factor (the level).");
        }
        if (spreadFactorCount < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(spreadFactorCount), spreadFactorCount, "Spread factor count cannot be negative.");
        }
    }

    private static void AddInto(FactorExposures e, double[] first, double[] second, int n)
    {
        var m = e.FactorCount;
        // Base factors first, then spread factors: an index keeps its meaning in the wider layout.
        for (var a = 0; a < m; a++)
        {
            first[a] += e._first[a];
            for (var b = 0; b < m; b++)
            {
                second[a * n + b] += e._second[a * m + b];
            }
        }
    }

    private int BaseIndex(int k)
    {
        if ((uint)k >= (uint)BaseFactorCount)
        {
            throw new ArgumentOutOfRangeException(nameof(k), k, string.Create(CultureInfo.InvariantCulture, $"Base factor index must be in [0, {BaseFactorCount})."));
        }
        return k;
    }

    // -1 when the spread factor is beyond this exposure's spread factors (its figures are zero).
    private int SpreadIndex(int k)
    {
        if (k < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(k), k, "Spread factor index cannot be negative.");
        }
        return k < SpreadFactorCount ? BaseFactorCount + k : -1;
    }
}
