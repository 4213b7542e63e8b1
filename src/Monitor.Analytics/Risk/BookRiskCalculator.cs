using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;
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
        if (segment.Count > 0 && (segment.DateIndices[0] < 0 || segment.DateIndices[^1] >= grid.DateCount))
        {
            throw new InvalidOperationException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Ledger date index {segment.DateIndices[^1]} is beyond the grid's {grid.DateCount} dates: rebuild the grid after adding trades."));
        }
        Span<double> acc = stackalloc double[rows.Stride];
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
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism };
        // Key-major: all books' flows on one curve key are summed while that key's rows are warm in cache
        // (rows of all keys together can exceed the cache; the pass is bound by row traffic).
        var keys = ledgers.SelectMany(l => l.CurveKeys).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        foreach (var ledger in ledgers)
        {
            foreach (var key in ledger.CurveKeys)
            {
                _ = ledger.GetSegment(key); // compact dirty ledgers before the parallel pass
            }
        }
        var perKey = new FactorExposures?[keys.Length, ledgers.Count];
        foreach (var (k, key) in keys.Index())
        {
            Parallel.For(0, ledgers.Count, options, i =>
            {
                if (ledgers[i].GetSegment(key).Count > 0)
                {
                    perKey[k, i] = ComputeForCurveKey(ledgers[i], grid, key);
                }
            });
        }
        var results = new BookRisk[ledgers.Count];
        for (var i = 0; i < results.Length; i++)
        {
            var byKey = new Dictionary<string, FactorExposures>(StringComparer.Ordinal);
            var total = FactorExposures.Zero(grid.BaseFactorCount, 0);
            for (var k = 0; k < keys.Length; k++)
            {
                if (perKey[k, i] is { } exposures)
                {
                    byKey.Add(keys[k], exposures);
                    total = total.Plus(exposures);
                }
            }
            results[i] = new BookRisk(total, byKey);
        }
        return results;
    }

    // acc[m] += amount_i * row(date_i)[m] over all entries; rows and acc are padded to whole SIMD vectors.
    // Columns go in chunks of up to four vectors held in registers (one pass over the ledger per chunk): keeping the
    // accumulators out of memory is what makes this loop fast. Indices were checked against the grid by the caller
    // (ascending, the last below DateCount), so the loads skip bounds checks.
    private static void Accumulate(ReadOnlySpan<int> dateIndices, ReadOnlySpan<double> amounts, double[] data, int stride, Span<double> acc)
    {
        var lanes = Vector<double>.Count;
        var vectors = stride / lanes;
        ref var rows = ref MemoryMarshal.GetArrayDataReference(data);
        ref var index0 = ref MemoryMarshal.GetReference(dateIndices);
        ref var amount0 = ref MemoryMarshal.GetReference(amounts);
        var count = dateIndices.Length;
        for (var first = 0; first < vectors; first += 4)
        {
            var width = Math.Min(4, vectors - first);
            var column = (nuint)(first * lanes);
            var n = (nuint)lanes;
            Vector<double> a0 = default, a1 = default, a2 = default, a3 = default;
            for (var i = 0; i < count; i++)
            {
                var a = new Vector<double>(Unsafe.Add(ref amount0, i));
                var offset = (nuint)Unsafe.Add(ref index0, i) * (nuint)stride + column;
                a0 += a * Vector.LoadUnsafe(ref rows, offset);
                if (width > 1)
                {
                    a1 += a * Vector.LoadUnsafe(ref rows, offset + n);
                }
                if (width > 2)
                {
                    a2 += a * Vector.LoadUnsafe(ref rows, offset + 2 * n);
                }
                if (width > 3)
                {
                    a3 += a * Vector.LoadUnsafe(ref rows, offset + 3 * n);
                }
            }
            var target = acc[(first * lanes)..];
            a0.CopyTo(target);
            if (width > 1)
            {
                a1.CopyTo(target[lanes..]);
            }
            if (width > 2)
            {
                a2.CopyTo(target[(2 * lanes)..]);
            }
            if (width > 3)
            {
                a3.CopyTo(target[(3 * lanes)..]);
            }
        }
    }
}
