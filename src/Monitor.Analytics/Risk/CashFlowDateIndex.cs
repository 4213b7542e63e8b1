namespace Monitor.Analytics.Risk;

/// <summary>
/// Numbers every distinct cash-flow date of all books: a date keeps its index for the life of the index, so
/// ledgers can store small ints and a <see cref="CurveGrid"/> evaluates each date once for all books.
/// Append-only; not thread-safe for writers (one writer, readers only while nobody adds).
/// </summary>
public sealed class CashFlowDateIndex
{
    private readonly Dictionary<int, int> _indexByDayNumber = [];
    private readonly List<DateOnly> _dates = [];

    /// <summary>Number of dates registered so far.</summary>
    public int Count => _dates.Count;

    /// <summary>The date with index <paramref name="index"/>.</summary>
    public DateOnly this[int index] => _dates[index];

    /// <summary>Index of <paramref name="date"/>, registering it if new.</summary>
    public int GetOrAdd(DateOnly date)
    {
        if (!_indexByDayNumber.TryGetValue(date.DayNumber, out var index))
        {
            index = _dates.Count;
            _indexByDayNumber.Add(date.DayNumber, index);
            _dates.Add(date);
        }
        return index;
    }

    /// <summary>Index of <paramref name="date"/> if registered.</summary>
    public bool TryGetIndex(DateOnly date, out int index) => _indexByDayNumber.TryGetValue(date.DayNumber, out index);
}
