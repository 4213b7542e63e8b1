using Monitor.Analytics.Risk;

namespace Monitor.Service.Engine;

/// <summary>
/// One revaluation's money moments of one book, a row per curve key it holds (keys in ordinal order), kept instead of
/// <see cref="FactorExposures"/> objects: the limit measures are read from the rows directly, and the full
/// <see cref="BookRisk"/> is built only when someone asks for it (then kept, so the same object comes back).
/// </summary>
internal sealed class BookMoments
{
    private readonly BookKeySet _keys;
    private readonly double[] _rows;
    private BookRisk? _risk;

    /// <param name="keys">The curve keys the rows belong to, shared by the books holding the same keys.</param>
    /// <param name="rows">The rows one after the other, <see cref="BookKeySet.Width"/> doubles for each key; kept, not copied.</param>
    public BookMoments(BookKeySet keys, double[] rows)
    {
        _keys = keys;
        _rows = rows;
    }

    /// <summary>
    /// Total and per-key exposures exactly as the revaluation used to build them: each key's exposures from its row, the
    /// total summed from zero key by key in ordinal order (<see cref="FactorExposures.Plus"/>).
    /// </summary>
    public BookRisk Risk => _risk ??= BuildRisk();

    private BookRisk BuildRisk()
    {
        var total = FactorExposures.Zero(_keys.BaseFactorCount, 0);
        var byKey = new Dictionary<string, FactorExposures>(_keys.Count, StringComparer.Ordinal);
        for (var k = 0; k < _keys.Count; k++)
        {
            var exposures = FactorExposures.FromMoments(_keys.BaseFactorCount, _keys.SpreadFactorCount(k), _rows.AsSpan(_keys.Offset(k), _keys.Width(k)));
            byKey.Add(_keys.Key(k), exposures);
            total = total.Plus(exposures);
        }
        return new BookRisk(total, byKey);
    }
}
