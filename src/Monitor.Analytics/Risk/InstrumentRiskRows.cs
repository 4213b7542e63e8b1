using System.Collections.Concurrent;
using System.Globalization;
using System.Numerics;

namespace Monitor.Analytics.Risk;

/// <summary>
/// The money moments of one unit (100 face) of every instrument of an <see cref="InstrumentCashFlowTable"/> on one
/// <see cref="CurveGrid"/>: row_i = sum over the instrument's flows of amount x grid row of (its curve key, date),
/// in a layout common to all keys (base factors, then spread factors). Built once per curve change, for all books.
/// </summary>
/// <remarks>
/// Cost: one SIMD multiply-add per flow and vector of the row (the whole table's flows, about 40 per bond), instruments
/// split over threads; memory: instruments x stride doubles (3,000 instruments, NS + NS durations: 8 doubles, 192 KB).
/// </remarks>
public sealed class InstrumentRiskRows
{
    private InstrumentRiskRows(CommonMomentLayout layout, int count, double[] data)
    {
        Layout = layout;
        Count = count;
        Data = data;
    }

    /// <summary>Number of instruments covered.</summary>
    public int Count { get; }

    /// <summary>Whether convexities are included.</summary>
    public RiskDepth Depth => Layout.Depth;

    /// <summary>Number of base curve factors.</summary>
    public int BaseFactorCount => Layout.BaseFactorCount;

    /// <summary>Spread factors of the common layout (the most of any curve key of the grid).</summary>
    public int SpreadFactorCount => Layout.SpreadFactorCount;

    internal CommonMomentLayout Layout { get; }

    internal double[] Data { get; }

    internal int Stride => Layout.Stride;

    /// <summary>Evaluates every instrument of <paramref name="table"/> on <paramref name="grid"/>.</summary>
    public static InstrumentRiskRows Build(InstrumentCashFlowTable table, CurveGrid grid, RiskDepth depth, int maxDegreeOfParallelism = -1)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(grid);
        if (table.MaxDateIndex >= grid.DateCount)
        {
            throw new InvalidOperationException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Instrument date index {table.MaxDateIndex} is beyond the grid's {grid.DateCount} dates: rebuild the grid after registering instruments."));
        }
        BookRiskCalculator.CheckDepth(grid, depth);
        var spreadFactors = grid.CurveKeys.Max(k => grid.RowsFor(k).SpreadFactorCount);
        var layout = new CommonMomentLayout(grid.BaseFactorCount, spreadFactors, depth);
        var count = table.Count;
        var keys = table.CurveKeys;
        var sources = new Dictionary<string, Source>(StringComparer.Ordinal);
        var sourceOf = new Source[count];
        for (var i = 0; i < count; i++)
        {
            if (!sources.TryGetValue(keys[i], out var source))
            {
                var rows = grid.RowsFor(keys[i]);
                var map = layout.MapFrom(rows.BaseFactorCount + rows.SpreadFactorCount);
                var lanes = Vector<double>.Count;
                source = new Source(rows, map, (map.Length + lanes - 1) / lanes);
                sources.Add(keys[i], source);
            }
            sourceOf[i] = source;
        }
        var data = new double[Math.Max(1, count) * layout.Stride];
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism };
        var chunk = Math.Max(64, count / (4 * Environment.ProcessorCount));
        // A table of one chunk or less (the load's 40 bonds) runs on the calling thread: no pool threads woken for it.
        if (count <= chunk || maxDegreeOfParallelism == 1)
        {
            FillRange(Tuple.Create(0, count));
        }
        else
        {
            Parallel.ForEach(Partitioner.Create(0, count, chunk), options, FillRange);
        }
        return new InstrumentRiskRows(layout, count, data);

        void FillRange(Tuple<int, int> range)
        {
            Span<double> acc = stackalloc double[MaxGridStride];
            var starts = table.Starts;
            var dateIndices = table.DateIndices;
            var amounts = table.Amounts;
            for (var i = range.Item1; i < range.Item2; i++)
            {
                var s = sourceOf[i];
                var from = starts[i];
                var length = starts[i + 1] - from;
                RowAccumulator.Accumulate(dateIndices.Slice(from, length), amounts.Slice(from, length), s.Rows.Data, s.Rows.Stride, s.Vectors, acc);
                var target = data.AsSpan(i * layout.Stride, layout.Stride);
                for (var c = 0; c < s.Map.Length; c++)
                {
                    target[s.Map[c]] = acc[c];
                }
            }
        }
    }

    /// <summary>Exposures of one unit (100 face) of <paramref name="instrument"/> (only for <see cref="RiskDepth.Full"/>).</summary>
    public FactorExposures Exposures(int instrument)
    {
        if (Depth != RiskDepth.Full)
        {
            throw new InvalidOperationException("These rows were built with RiskDepth.Durations: they hold no convexities.");
        }
        if ((uint)instrument >= (uint)Count)
        {
            throw new ArgumentOutOfRangeException(nameof(instrument), instrument, string.Create(CultureInfo.InvariantCulture, $"Instrument number must be in [0, {Count})."));
        }
        return new FactorExposures(BaseFactorCount, SpreadFactorCount, Data.AsSpan(instrument * Stride, Layout.Width));
    }

    // Widest grid row: Svensson base + Svensson spread, 8 factors: 45 doubles padded to 48 (AVX-512 lanes: 48 too).
    internal const int MaxGridStride = 64;

    private sealed record Source(CurveGrid.GridRows Rows, int[] Map, int Vectors);
}
