using System.Globalization;
using System.Numerics;
using System.Runtime.InteropServices;

namespace Monitor.Analytics.Risk;

/// <summary>
/// The fast path: a book's <see cref="FactorExposures"/> as a weighted sum of the <see cref="CurveGrid"/> rows of
/// its ledger dates, one SIMD multiply-add per lane group per date, no allocation per cash flow.
/// Agrees with <see cref="PositionRisk"/> summed over the positions (exposures are linear in the cash flows).
/// </summary>
public static class BookRiskCalculator
{
    /// <summary>
    /// Exposures of the whole book and of each curve key. In the total, spread figures of all spread groups are
    /// summed factor by factor (all spread curves moving together); per-group figures are in
    /// <see cref="BookRisk.ByCurveKey"/>.
    /// </summary>
    public static BookRisk Compute(BookCashFlowLedger ledger, CurveGrid grid)
    {
        ArgumentNullException.ThrowIfNull(ledger);
        ArgumentNullException.ThrowIfNull(grid);
        var byKey = new Dictionary<string, FactorExposures>(StringComparer.Ordinal);
        var total = FactorExposures.Zero(grid.BaseFactorCount, 0);
        foreach (var key in ledger.CurveKeys)
        {
            var exposures = ComputeForCurveKey(ledger, grid, key);
            byKey.Add(key, exposures);
            total = total.Plus(exposures);
        }
        return new BookRisk(total, byKey);
    }

    /// <summary>Exposures of the book's flows under one curve key (zero exposures if it holds none).</summary>
    public static FactorExposures ComputeForCurveKey(BookCashFlowLedger ledger, CurveGrid grid, string? curveKey)
    {
        ArgumentNullException.ThrowIfNull(ledger);
        ArgumentNullException.ThrowIfNull(grid);
        var segment = ledger.GetSegment(curveKey);
        var rows = grid.RowsFor(segment.CurveKey);
        if (segment.Count > 0 && segment.DateIndices[^1] >= grid.DateCount)
        {
            throw new InvalidOperationException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Ledger date index {segment.DateIndices[^1]} is beyond the grid's {grid.DateCount} dates: rebuild the grid after adding trades."));
        }
        Span<double> acc = stackalloc double[rows.Stride];
        acc.Clear();
        Accumulate(segment.DateIndices, segment.Amounts, rows.Data, rows.Stride, acc);
        return new FactorExposures(rows.BaseFactorCount, rows.SpreadFactorCount, acc[..rows.Width]);
    }

    /// <summary>
    /// Risk of many books on one grid, books split over up to <paramref name="maxDegreeOfParallelism"/> threads
    /// (-1: the runtime's choice). The ledgers must not change meanwhile.
    /// </summary>
    public static BookRisk[] ComputeAll(IReadOnlyList<BookCashFlowLedger> ledgers, CurveGrid grid, int maxDegreeOfParallelism = -1)
    {
        ArgumentNullException.ThrowIfNull(ledgers);
        ArgumentNullException.ThrowIfNull(grid);
        var results = new BookRisk[ledgers.Count];
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism };
        Parallel.For(0, ledgers.Count, options, i => results[i] = Compute(ledgers[i], grid));
        return results;
    }

    // acc[m] += amount_i * row(date_i)[m] over all entries; rows and acc are padded to whole SIMD vectors.
    private static void Accumulate(ReadOnlySpan<int> dateIndices, ReadOnlySpan<double> amounts, double[] data, int stride, Span<double> acc)
    {
        var accV = MemoryMarshal.Cast<double, Vector<double>>(acc);
        var all = data.AsSpan();
        for (var i = 0; i < dateIndices.Length; i++)
        {
            var a = new Vector<double>(amounts[i]);
            var row = MemoryMarshal.Cast<double, Vector<double>>(all.Slice(dateIndices[i] * stride, stride));
            for (var v = 0; v < accV.Length; v++)
            {
                accV[v] += a * row[v];
            }
        }
    }
}
