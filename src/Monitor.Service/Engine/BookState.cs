using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>
/// One book: its positions by instrument, the same positions as quantities of registered instruments per curve key
/// (what the risk pass reads), and its last figures.
/// </summary>
public sealed class BookState
{
    // Per curve key, so that a revaluation yields the per-key breakdown (spread-group limits) without a second pass.
    private readonly Dictionary<string, BookHoldings> _holdings = new(StringComparer.Ordinal);

    public BookState(string id, string desk)
    {
        Id = id;
        Desk = desk;
    }

    public string Id { get; }

    public string Desk { get; }

    /// <summary>Signed face amount by instrument id.</summary>
    public Dictionary<string, double> Positions { get; } = new(StringComparer.Ordinal);

    /// <summary>Curve keys under which the book holds instruments with cash flows still to come, in ordinal order.</summary>
    public IReadOnlyList<string> CurveKeys =>
        _holdings.Where(h => h.Value.Count > 0).Select(h => h.Key).Order(StringComparer.Ordinal).ToArray();

    private BookUpdate? _last;
    private BookRisk? _risk;

    public BookExposures? Exposures { get; set; }

    /// <summary>The last revaluation's exposures, built from its moment rows on first read (then the same object, the update's).</summary>
    public BookRisk? Risk
    {
        get => _risk ?? _last?.Risk;
        set
        {
            _risk = value;
            _last = null;
        }
    }

    public DateTimeOffset? UpdatedAt { get; set; }

    /// <summary>Why the last figures are provisional (<see cref="BookUpdate.ProvisionalReasons"/>); empty when they are not.</summary>
    public IReadOnlyList<string> ProvisionalReasons => _last?.ProvisionalReasons ?? [];

    /// <summary>A revaluation's figures: the update carries the measures and the moments behind <see cref="Risk"/>.</summary>
    internal void SetFigures(BookUpdate update, DateTimeOffset now)
    {
        _last = update;
        _risk = null;
        Exposures = update.Exposures;
        UpdatedAt = now;
    }

    /// <summary>Whether the book holds anything under a curve key that <paramref name="matches"/> (no allocation: once per book per change).</summary>
    internal bool HoldsAny(Func<string, bool> matches)
    {
        foreach (var (key, holdings) in _holdings)
        {
            if (holdings.Count > 0 && matches(key))
            {
                return true;
            }
        }
        return false;
    }

    /// <summary>Holdings under <paramref name="curveKey"/>, or null when the book holds nothing there.</summary>
    internal BookHoldings? HoldingsUnder(string curveKey) =>
        _holdings.TryGetValue(curveKey, out var holdings) && holdings.Count > 0 ? holdings : null;

    /// <summary>Adds <paramref name="quantity"/> (face / 100) of instrument <paramref name="number"/> of the key's table.</summary>
    internal void AddHolding(string curveKey, int number, double quantity)
    {
        if (!_holdings.TryGetValue(curveKey, out var holdings))
        {
            _holdings.Add(curveKey, holdings = new BookHoldings());
        }
        holdings.Add(number, quantity);
    }

    /// <summary>Drops whatever quantity of instrument <paramref name="number"/> is left (the position was closed).</summary>
    internal void ClearHolding(string curveKey, int number)
    {
        if (_holdings.TryGetValue(curveKey, out var holdings))
        {
            holdings.Remove(number, holdings.QuantityOf(number));
        }
    }
}
