using Monitor.Analytics.Risk;

namespace Monitor.Service.Engine;

/// <summary>
/// One revaluation's money moments of one book, a row per curve key it holds (keys in ordinal order), kept instead of
/// <see cref="FactorExposures"/> objects: the limit measures are read from the rows directly, and the full
/// <see cref="BookRisk"/> is built from them only when someone asks (<see cref="BookUpdate.Risk"/>).
/// </summary>
/// <remarks>
/// A struct over a slice of a block that the books of one revaluation share (<see cref="BookFiguresBuilder"/>): no object
/// and no array per book. Blocks stay below the large-object threshold; a block lives while any book's last figures
/// point into it, at most one block per book that was not revalued since.
/// </remarks>
internal readonly struct BookMoments
{
    private readonly BookKeySet _keys;
    private readonly double[] _block;
    private readonly int _offset;

    /// <param name="keys">The curve keys the rows belong to, shared by the books holding the same keys.</param>
    /// <param name="block">The block holding the rows from <paramref name="offset"/> on, <see cref="BookKeySet.TotalWidth"/> doubles; never changed after.</param>
    /// <param name="offset">Where the book's first row starts.</param>
    public BookMoments(BookKeySet keys, double[] block, int offset)
    {
        _keys = keys;
        _block = block;
        _offset = offset;
    }

    /// <summary>
    /// Total and per-key exposures exactly as the revaluation used to build them: each key's exposures from its row, the
    /// total summed from zero key by key in ordinal order (<see cref="FactorExposures.Plus"/>).
    /// </summary>
    public BookRisk BuildRisk()
    {
        var total = FactorExposures.Zero(_keys.BaseFactorCount, 0);
        var byKey = new Dictionary<string, FactorExposures>(_keys.Count, StringComparer.Ordinal);
        for (var k = 0; k < _keys.Count; k++)
        {
            var exposures = FactorExposures.FromMoments(
                _keys.BaseFactorCount, _keys.SpreadFactorCount(k), _block.AsSpan(_offset + _keys.Offset(k), _keys.Width(k)));
            byKey.Add(_keys.Key(k), exposures);
            total = total.Plus(exposures);
        }
        return new BookRisk(total, byKey);
    }
}
