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
        CheckCoversAllDates(grid);
        if (grid.Depth != RiskDepth.Full)
        {
            throw new ArgumentException("This grid was built with RiskDepth.Durations (no convexities): use ComputeAll with RiskDepth.Durations or a full grid.", nameof(grid));
        }
        var segment = ledger.GetSegment(curveKey);
        var rows = grid.RowsFor(segment.CurveKey);
        if (segment.Count > 0 && (segment.DateIndices[0] < 0 || segment.DateIndices[^1] >= grid.DateCount))
        {
            throw new InvalidOperationException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Ledger date index {segment.DateIndices[^1]} is beyond the grid's {grid.DateCount} dates: rebuild the grid after adding trades."));
        }
        Span<double> acc = stackalloc double[rows.Stride];
        RowAccumulator.Accumulate(segment.DateIndices, segment.Amounts, rows.Data, rows.Stride, rows.Stride / Vector<double>.Count, acc);
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

    /// <summary>
    /// Whole-book exposures of many date-merged ledgers into one <see cref="BookRiskMatrix"/> (no per-book objects),
    /// reading only the columns <paramref name="depth"/> needs: for <see cref="RiskDepth.Durations"/> the first
    /// 8 of a row's 28 doubles (NS + NS spread). Same sums as <see cref="Compute"/>, spread groups summed factor by factor.
    /// </summary>
    public static BookRiskMatrix ComputeAll(
        IReadOnlyList<BookCashFlowLedger> ledgers, CurveGrid grid, RiskDepth depth, BookRiskMatrix? output = null, int maxDegreeOfParallelism = -1)
    {
        ArgumentNullException.ThrowIfNull(ledgers);
        ArgumentNullException.ThrowIfNull(grid);
        CheckDepth(grid, depth);
        CheckCoversAllDates(grid);
        var spreadFactors = grid.CurveKeys.Max(k => grid.RowsFor(k).SpreadFactorCount);
        var layout = new CommonMomentLayout(grid.BaseFactorCount, spreadFactors, depth);
        var n = ledgers.Count;
        if (output is null || !output.Fits(n, layout))
        {
            output = new BookRiskMatrix(n, grid.BaseFactorCount, spreadFactors, depth);
        }
        var sources = new Dictionary<string, (CurveGrid.GridRows Rows, int[] Map, int Vectors)>(StringComparer.Ordinal);
        var segments = new LedgerSegment[n][];
        for (var b = 0; b < n; b++)
        {
            var ledger = ledgers[b] ?? throw new ArgumentException($"ledgers[{b}] is null.", nameof(ledgers));
            var keys = ledger.RawCurveKeys;
            var list = new LedgerSegment[keys.Count];
            var i = 0;
            foreach (var key in keys)
            {
                var segment = ledger.GetSegment(key); // compacts on this thread
                if (segment.Count > 0 && segment.DateIndices[^1] >= grid.DateCount)
                {
                    throw new InvalidOperationException(
                        string.Create(CultureInfo.InvariantCulture,
                            $"Ledger date index {segment.DateIndices[^1]} is beyond the grid's {grid.DateCount} dates: rebuild the grid after adding trades."));
                }
                if (!sources.ContainsKey(key))
                {
                    var rows = grid.RowsFor(key);
                    var map = layout.MapFrom(rows.BaseFactorCount + rows.SpreadFactorCount);
                    sources.Add(key, (rows, map, (map.Length + Vector<double>.Count - 1) / Vector<double>.Count));
                }
                list[i++] = segment;
            }
            segments[b] = list;
        }
        var result = output;
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism };
        var chunk = Math.Max(1, n / (8 * Environment.ProcessorCount));
        Parallel.ForEach(System.Collections.Concurrent.Partitioner.Create(0, n, chunk), options, range =>
        {
            Span<double> acc = stackalloc double[InstrumentRiskRows.MaxGridStride];
            for (var b = range.Item1; b < range.Item2; b++)
            {
                var target = result.Row(b);
                target.Clear();
                foreach (var segment in segments[b])
                {
                    var (rows, map, vectors) = sources[segment.CurveKey];
                    RowAccumulator.Accumulate(segment.DateIndices, segment.Amounts, rows.Data, rows.Stride, vectors, acc);
                    for (var c = 0; c < map.Length; c++)
                    {
                        target[map[c]] += acc[c];
                    }
                }
            }
        });
        return output;
    }

    internal static void CheckCoversAllDates(CurveGrid grid)
    {
        if (!grid.CoversAllDates)
        {
            throw new ArgumentException("This grid was built for instruments only (CurveGrid.BuildForInstruments): it cannot price date-merged ledgers.", nameof(grid));
        }
    }

    internal static void CheckDepth(CurveGrid grid, RiskDepth depth)
    {
        if (depth == RiskDepth.Full && grid.Depth != RiskDepth.Full)
        {
            throw new ArgumentException("Convexities asked of a grid built with RiskDepth.Durations.", nameof(depth));
        }
    }
}
