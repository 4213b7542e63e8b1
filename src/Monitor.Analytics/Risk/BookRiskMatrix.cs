using System.Globalization;
using System.Numerics;

namespace Monitor.Analytics.Risk;

/// <summary>
/// Whole-book exposures of many books from one batch pass, one padded row of money moments per book (no object per
/// book). Spread figures of all spread groups are summed factor by factor, as in <see cref="BookRisk.Total"/>.
/// Money forms as in <see cref="FactorExposures"/>: value in money, money durations -dP/db_k per unit factor rise.
/// Reuse an instance across passes to allocate nothing.
/// </summary>
public sealed class BookRiskMatrix
{
    private const double BasisPoint = 1e-4;
    private readonly double[] _data;

    /// <summary>An empty matrix for <paramref name="bookCount"/> books in the given factor layout.</summary>
    public BookRiskMatrix(int bookCount, int baseFactorCount, int spreadFactorCount, RiskDepth depth)
    {
        if (bookCount < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(bookCount), bookCount, "Book count cannot be negative.");
        }
        FactorExposures.CheckCounts(baseFactorCount, spreadFactorCount);
        Layout = new CommonMomentLayout(baseFactorCount, spreadFactorCount, depth);
        BookCount = bookCount;
        _data = new double[Math.Max(1, bookCount) * Layout.Stride + Vector<double>.Count];
    }

    /// <summary>Number of books (rows).</summary>
    public int BookCount { get; }

    /// <summary>Number of base curve factors.</summary>
    public int BaseFactorCount => Layout.BaseFactorCount;

    /// <summary>Number of spread factors (the most of any spread group).</summary>
    public int SpreadFactorCount => Layout.SpreadFactorCount;

    /// <summary>Whether convexities were computed.</summary>
    public RiskDepth Depth => Layout.Depth;

    /// <summary>Length of <see cref="Moments"/>: 1 + n + n(n+1)/2 for n = base + spread factors.</summary>
    public int MomentWidth => Layout.Width;

    internal CommonMomentLayout Layout { get; }

    /// <summary>Dirty value in money of book <paramref name="book"/>.</summary>
    public double Value(int book) => _data[Offset(book)];

    /// <summary>Money gained when the zero curve falls 1 bp in parallel (= base level money per bp).</summary>
    public double Dv01(int book) => BaseMoneyDuration(book, 0) * BasisPoint;

    /// <summary>Base factor money duration -dP/db_k.</summary>
    public double BaseMoneyDuration(int book, int k) =>
        (uint)k < (uint)BaseFactorCount
            ? _data[Offset(book) + 1 + k]
            : throw new ArgumentOutOfRangeException(nameof(k), k, string.Create(CultureInfo.InvariantCulture, $"Base factor index must be in [0, {BaseFactorCount})."));

    /// <summary>Spread factor money duration -dP/dg_k (summed over spread groups).</summary>
    public double SpreadMoneyDuration(int book, int k) =>
        (uint)k < (uint)SpreadFactorCount
            ? _data[Offset(book) + 1 + BaseFactorCount + k]
            : throw new ArgumentOutOfRangeException(nameof(k), k, string.Create(CultureInfo.InvariantCulture, $"Spread factor index must be in [0, {SpreadFactorCount})."));

    /// <summary>Base factor duration D_k in years (value-weighted).</summary>
    public double BaseDuration(int book, int k) => BaseMoneyDuration(book, k) / Value(book);

    /// <summary>Spread factor duration in years (value-weighted).</summary>
    public double SpreadDuration(int book, int k) => SpreadMoneyDuration(book, k) / Value(book);

    /// <summary>The book's full exposures (only for <see cref="RiskDepth.Full"/>: a durations pass has no convexities).</summary>
    public FactorExposures ToExposures(int book)
    {
        if (Depth != RiskDepth.Full)
        {
            throw new InvalidOperationException("This matrix was computed with RiskDepth.Durations: it holds no convexities.");
        }
        return new FactorExposures(BaseFactorCount, SpreadFactorCount, _data.AsSpan(Offset(book), Layout.Width));
    }

    /// <summary>
    /// The book's money moments in the layout of <see cref="FactorExposures.FromMoments"/> (only for
    /// <see cref="RiskDepth.Full"/>): value, the first moments, then the upper triangle of second moments.
    /// </summary>
    public ReadOnlySpan<double> Moments(int book)
    {
        if (Depth != RiskDepth.Full)
        {
            throw new InvalidOperationException("This matrix was computed with RiskDepth.Durations: it holds no convexities.");
        }
        return _data.AsSpan(Offset(book), Layout.Width);
    }

    internal Span<double> Row(int book) => _data.AsSpan(Offset(book), Layout.Stride);

    internal bool Fits(int bookCount, CommonMomentLayout layout) =>
        BookCount == bookCount && Layout.BaseFactorCount == layout.BaseFactorCount
        && Layout.SpreadFactorCount == layout.SpreadFactorCount && Layout.Depth == layout.Depth;

    private int Offset(int book) =>
        (uint)book < (uint)BookCount
            ? book * Layout.Stride
            : throw new ArgumentOutOfRangeException(nameof(book), book, string.Create(CultureInfo.InvariantCulture, $"Book index must be in [0, {BookCount})."));
}
