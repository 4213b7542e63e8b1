using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>
/// Turns one revaluation's per-key book matrices into each book's figures: its moment rows (<see cref="BookMoments"/>,
/// the <see cref="BookRisk"/> on demand) and its limit measures (<see cref="BookExposures"/>), read straight from the
/// rows: no dictionary per book, no <see cref="FactorExposures"/> objects, no closure per measure; the rows are
/// copied into blocks the books share.
/// </summary>
/// <remarks>
/// Exactly the figures of <see cref="ExposureMapping.ToBookExposures"/> on the <see cref="BookRisk"/> the rows make: the
/// total's value, first moments and level second moment are summed from zero key by key in ordinal key order, as
/// <see cref="FactorExposures.Plus"/> sums them, and mapped with the same arithmetic
/// (<see cref="ExposureMapping.MeasuresFromMoments"/>). RiskEngineHoldingsTests checks this bit for bit.
/// </remarks>
internal sealed class BookFiguresBuilder
{
    /// <summary>8,192 doubles, 64 KB: a shared block of moment rows stays below the 85,000-byte large-object threshold.</summary>
    private const int BlockDoubles = 8_192;

    private readonly int _baseFactorCount;
    private readonly List<string> _keys;
    private readonly BookRiskMatrix[] _matrices;
    private readonly Dictionary<ulong, BookKeySet> _keySets = [];
    private readonly double[] _first;
    private readonly double[] _measures = new double[MeasureFigures.MeasureCount];
    private int _booksLeft;
    private double[] _block = [];
    private int _used;

    /// <param name="baseFactorCount">Base curve factors.</param>
    /// <param name="keys">The revaluation's curve keys in ordinal order (one per pass).</param>
    /// <param name="matrices">Each key's book matrix (full depth).</param>
    /// <param name="books">How many books <see cref="Build"/> will be called for (sizes the shared blocks).</param>
    public BookFiguresBuilder(int baseFactorCount, List<string> keys, BookRiskMatrix[] matrices, int books)
    {
        _booksLeft = books;
        _baseFactorCount = baseFactorCount;
        _keys = keys;
        _matrices = matrices;
        var spread = 0;
        foreach (var matrix in matrices)
        {
            if (matrix.BaseFactorCount != baseFactorCount || matrix.Depth != RiskDepth.Full)
            {
                throw new InvalidOperationException($"Book matrices must be full depth on the {baseFactorCount} base factors of the government curve.");
            }
            spread = Math.Max(spread, matrix.SpreadFactorCount);
        }
        _first = new double[baseFactorCount + spread];
    }

    /// <param name="rowOf">The book's row in each key's matrix, -1 where it holds nothing under the key.</param>
    public (BookMoments Moments, BookExposures Exposures) Build(ReadOnlySpan<int> rowOf)
    {
        var keySet = KeySet(rowOf);
        var (data, offset) = Reserve(keySet.TotalWidth);
        var value = 0.0;
        var level = 0.0;
        var first = _first.AsSpan(0, _baseFactorCount + keySet.MaxSpreadFactorCount);
        first.Clear();
        Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>? bySpreadGroup = null;
        for (int k = 0, q = 0; k < rowOf.Length; k++)
        {
            if (rowOf[k] < 0)
            {
                continue;
            }
            var row = _matrices[k].Moments(rowOf[k]);
            row.CopyTo(data.AsSpan(offset + keySet.Offset(q++)));
            var spread = _matrices[k].SpreadFactorCount;
            var n = _baseFactorCount + spread;
            value += row[0];
            for (var a = 0; a < n; a++)
            {
                first[a] += row[1 + a];
            }
            level += row[1 + n];
            if (!CurveKey.IsGovernment(_keys[k]))
            {
                ExposureMapping.MeasuresFromMoments(_baseFactorCount, spread, row[0], row.Slice(1, n), row[1 + n], _measures);
                bySpreadGroup ??= new Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>(StringComparer.Ordinal);
                bySpreadGroup[_keys[k]] = new MeasureFigures(_measures);
            }
        }
        ExposureMapping.MeasuresFromMoments(_baseFactorCount, keySet.MaxSpreadFactorCount, value, first, level, _measures);
        var exposures = new BookExposures { Totals = new MeasureFigures(_measures), BySpreadGroup = bySpreadGroup ?? ExposureMapping.NoSpreadGroups };
        return (new BookMoments(keySet, data, offset), exposures);
    }

    /// <summary>
    /// Room for one book's rows in the current block, or a new block sized for the books still to come at this width, at
    /// most <see cref="BlockDoubles"/> (below the large-object threshold) unless one book needs more.
    /// </summary>
    private (double[] Block, int Offset) Reserve(int width)
    {
        _booksLeft--;
        if (_used + width > _block.Length)
        {
            _block = new double[Math.Max(width, (int)Math.Min(BlockDoubles, (long)width * (_booksLeft + 1)))];
            _used = 0;
        }
        var offset = _used;
        _used += width;
        return (_block, offset);
    }

    // Books holding the same keys share one key set (a bit per key; past 64 keys each book gets its own).
    private BookKeySet KeySet(ReadOnlySpan<int> rowOf)
    {
        var mask = 0UL;
        for (var k = 0; k < rowOf.Length && rowOf.Length <= 64; k++)
        {
            if (rowOf[k] >= 0)
            {
                mask |= 1UL << k;
            }
        }
        if (rowOf.Length <= 64 && _keySets.TryGetValue(mask, out var shared))
        {
            return shared;
        }
        var keys = new List<string>();
        var spreads = new List<int>();
        var widths = new List<int>();
        for (var k = 0; k < rowOf.Length; k++)
        {
            if (rowOf[k] >= 0)
            {
                keys.Add(_keys[k]);
                spreads.Add(_matrices[k].SpreadFactorCount);
                widths.Add(_matrices[k].MomentWidth);
            }
        }
        var keySet = new BookKeySet(_baseFactorCount, [.. keys], [.. spreads], [.. widths]);
        if (rowOf.Length <= 64)
        {
            _keySets[mask] = keySet;
        }
        return keySet;
    }
}
