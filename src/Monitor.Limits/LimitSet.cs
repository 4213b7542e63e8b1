using System.Globalization;

namespace Monitor.Limits;

/// <summary>
/// All limit definitions, the book hierarchy, each book's latest exposures and each limit's status.
/// Aggregates books to desks and the firm and evaluates the limits a book's change can move.
/// </summary>
/// <remarks>
/// All state is held by the instance (no statics), so a service can keep one per partition of books;
/// desk and firm limits then need every book of their scope in the same instance, or an aggregating
/// step in front. Not thread-safe: one caller at a time.
/// Aggregation: desk and firm exposures are sums of book money figures (domain primer, "Factor
/// durations": book figures are sums of dollar figures), recomputed from the books on demand so that
/// no running total drifts.
/// </remarks>
public sealed class LimitSet
{
    private readonly Dictionary<string, LimitDefinition> _limits = new(StringComparer.Ordinal);
    private readonly Dictionary<LimitScope, List<LimitDefinition>> _limitsByScope = [];
    private readonly Dictionary<string, LimitStatus> _statuses = new(StringComparer.Ordinal);
    // Books with figures, in the order they were first reported (the order Reload lists dropped books in).
    private readonly Dictionary<string, BookSlot> _reported = new(StringComparer.Ordinal);
    private readonly List<BookSlot> _batch = [];
    private ScopeIndex _index;
    private long _batchMark;

    /// <exception cref="LimitConfigurationException">Any invalid definition, duplicate id or unknown scope; lists them all.</exception>
    public LimitSet(BookHierarchy hierarchy, IEnumerable<LimitDefinition> limits)
    {
        ArgumentNullException.ThrowIfNull(hierarchy);
        ArgumentNullException.ThrowIfNull(limits);
        var list = limits.ToList();
        ThrowIfInvalid(hierarchy, list);
        Hierarchy = hierarchy;
        _index = new ScopeIndex(hierarchy);
        Install(list);
        foreach (var limit in list)
        {
            _statuses[limit.Id] = LimitStatus.Within;
        }
    }

    public BookHierarchy Hierarchy { get; private set; }

    /// <summary>The definitions in the order they were given.</summary>
    public IReadOnlyCollection<LimitDefinition> Limits => _limits.Values;

    /// <exception cref="KeyNotFoundException">Unknown limit id.</exception>
    public LimitStatus StatusOf(string limitId) =>
        _statuses.TryGetValue(limitId, out var s) ? s : throw new KeyNotFoundException($"Limit '{limitId}' is not defined.");

    /// <summary>The book's last reported total exposures; empty when none were reported yet.</summary>
    public IReadOnlyDictionary<ExposureMeasure, double> ExposuresOf(string bookId) =>
        _reported.TryGetValue(bookId, out var slot) ? slot.Exposures!.Totals : new Dictionary<ExposureMeasure, double>();

    /// <summary>
    /// The scope's exposure: the sum over its books of the measure, over all positions or, with
    /// <paramref name="spreadGroup"/>, over the bonds of that spread group (a missing figure counts 0).
    /// </summary>
    public double ExposureOf(LimitScope scope, ExposureMeasure measure, string? spreadGroup = null) =>
        Sum(_index.Of(scope).Books, measure, spreadGroup);

    /// <summary>
    /// Replaces one book's exposures (a measure missing from <paramref name="exposures"/> counts 0) and
    /// evaluates the limits on that book, its desk and the firm that are active at <paramref name="asOf"/>.
    /// </summary>
    /// <returns>The status changes, book scope first, then desk, then firm.</returns>
    /// <exception cref="KeyNotFoundException">Unknown book.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A non-finite exposure; the message names book, measure and value. State is left untouched.</exception>
    public IReadOnlyList<LimitStatusChange> UpdateBook(string bookId, IReadOnlyDictionary<ExposureMeasure, double> exposures, DateTimeOffset asOf) =>
        UpdateBook(bookId, BookExposures.FromTotals(exposures ?? throw new ArgumentNullException(nameof(exposures))), asOf);

    /// <summary>As the overload with totals, with a spread-group breakdown for limits filtered by spread group.</summary>
    public IReadOnlyList<LimitStatusChange> UpdateBook(string bookId, BookExposures exposures, DateTimeOffset asOf)
    {
        var scopes = CheckBookUpdate(bookId, exposures);
        SetExposures(_index.Book(bookId)!, exposures.Snapshot());
        return EvaluateScopes(scopes, asOf, commit: true);
    }

    /// <summary>
    /// Replaces several books' exposures at once (a curve change revalues many books) and then evaluates each scope
    /// they touch once, on the new figures of all of them: the books' own limits in the order given, then their
    /// desks', then the firm's. Updating 1,000 books one at a time would sum the firm's books 1,000 times, and could
    /// report a firm status that only held while half the books had moved.
    /// </summary>
    /// <returns>The status changes, book scopes first, then desks, then the firm.</returns>
    /// <exception cref="KeyNotFoundException">Unknown book (nothing changed).</exception>
    /// <exception cref="ArgumentOutOfRangeException">A non-finite exposure, naming book, measure and value (nothing changed).</exception>
    public IReadOnlyList<LimitStatusChange> UpdateBooks(IReadOnlyList<(string BookId, BookExposures Exposures)> updates, DateTimeOffset asOf)
    {
        ArgumentNullException.ThrowIfNull(updates);
        // Per book: its slot (own scope, desk scope) instead of a scope list; every book checked before any changes.
        var slots = _batch;
        slots.Clear();
        for (var i = 0; i < updates.Count; i++)
        {
            var (bookId, exposures) = updates[i];
            slots.Add(CheckBook(bookId, exposures));
        }

        for (var i = 0; i < slots.Count; i++)
        {
            SetExposures(slots[i], updates[i].Exposures.Snapshot());
        }

        // Each scope once: book scopes first (in the order given), then desks (in the order first touched), then the firm.
        var mark = ++_batchMark;
        var changes = new List<LimitStatusChange>();
        foreach (var slot in slots)
        {
            if (slot.Own.Mark != mark)
            {
                slot.Own.Mark = mark;
                Evaluate(slot.Own, asOf, commit: true, changes);
            }
        }

        foreach (var slot in slots)
        {
            if (slot.Desk.Mark != mark)
            {
                slot.Desk.Mark = mark;
                Evaluate(slot.Desk, asOf, commit: true, changes);
            }
        }

        if (slots.Count > 0)
        {
            Evaluate(_index.Firm, asOf, commit: true, changes);
        }

        slots.Clear();
        return changes;
    }

    /// <summary>
    /// What-if: the status changes <see cref="UpdateBook(string, BookExposures, DateTimeOffset)"/> would produce for these exposures, without
    /// changing any state (for a check before a trade).
    /// </summary>
    public IReadOnlyList<LimitStatusChange> WhatIf(string bookId, IReadOnlyDictionary<ExposureMeasure, double> exposures, DateTimeOffset asOf) =>
        WhatIf(bookId, BookExposures.FromTotals(exposures ?? throw new ArgumentNullException(nameof(exposures))), asOf);

    /// <summary>As the overload with totals, with a spread-group breakdown.</summary>
    public IReadOnlyList<LimitStatusChange> WhatIf(string bookId, BookExposures exposures, DateTimeOffset asOf)
    {
        var scopes = CheckBookUpdate(bookId, exposures);
        var slot = _index.Book(bookId)!;
        var before = slot.Exposures;
        SetExposures(slot, exposures.Snapshot());
        try
        {
            return EvaluateScopes(scopes, asOf, commit: false);
        }
        finally
        {
            if (before is not null)
            {
                slot.Exposures = before;
            }
            else
            {
                _reported.Remove(bookId);
                slot.Exposures = null;
            }
        }
    }

    /// <summary>
    /// Removes the temporary limits that expired at or before <paramref name="asOf"/> (the business clock, given by the
    /// caller), returning each with its last status and its final change to <see cref="LimitStatus.Expired"/>.
    /// </summary>
    public IReadOnlyList<ExpiredLimit> RemoveExpired(DateTimeOffset asOf)
    {
        var expired = _limits.Values.Where(l => !l.IsActiveAt(asOf)).ToList();
        if (expired.Count == 0)
        {
            return [];
        }

        var result = expired.Select(l => new ExpiredLimit(l, _statuses[l.Id], Ended(l, LimitStatus.Expired))).ToList();
        var kept = _limits.Values.Where(l => l.IsActiveAt(asOf)).ToList();
        Install(kept);
        foreach (var l in expired)
        {
            _statuses.Remove(l.Id);
        }

        return result;
    }

    /// <summary>Every active limit's standing at <paramref name="asOf"/>, in definition order.</summary>
    public IReadOnlyList<LimitUse> CurrentUse(DateTimeOffset asOf) =>
        _limits.Values.Where(l => l.IsActiveAt(asOf)).Select(l =>
        {
            var exposure = ExposureOf(l.Scope, l.Measure, l.SpreadGroup);
            return new LimitUse(l, _statuses[l.Id], exposure, l.BoundFor(exposure), l.Utilisation(exposure));
        }).ToList();

    /// <summary>
    /// Replaces the hierarchy and definitions (configuration reload). Each removed limit ends with a change to
    /// <see cref="LimitStatus.Retired"/> on its scope's exposure before the reload (so a breach it held ends on record).
    /// Unchanged limits keep their status; modified limits start from their previous status, added limits from Within;
    /// then every active limit is re-evaluated against the current exposures, which reports any status the new
    /// definitions move.
    /// Exposures of books the new hierarchy does not list are dropped.
    /// </summary>
    /// <exception cref="LimitConfigurationException">The new configuration is invalid; the current one stays in force.</exception>
    public LimitReloadResult Reload(BookHierarchy hierarchy, IEnumerable<LimitDefinition> limits, DateTimeOffset asOf)
    {
        ArgumentNullException.ThrowIfNull(hierarchy);
        ArgumentNullException.ThrowIfNull(limits);
        var list = limits.ToList();
        ThrowIfInvalid(hierarchy, list);

        var newIds = list.Select(l => l.Id).ToHashSet(StringComparer.Ordinal);
        var added = list.Where(l => !_limits.ContainsKey(l.Id)).ToList();
        var removed = _limits.Values.Where(l => !newIds.Contains(l.Id)).ToList();
        var modified = list.Where(l => _limits.TryGetValue(l.Id, out var old) && old != l)
            .Select(l => new LimitModification(_limits[l.Id], l)).ToList();
        var dropped = _reported.Keys.Where(b => !hierarchy.ContainsBook(b)).ToList();
        // Judged on the old hierarchy, before any figures are dropped: the standing the limit leaves with.
        var retired = removed.Select(l => Ended(l, LimitStatus.Retired)).ToList();
        var hierarchyChanged = !Hierarchy.SameTreeAs(hierarchy);

        Hierarchy = hierarchy;
        foreach (var book in dropped)
        {
            _reported.Remove(book);
        }

        // Kept books move to the new hierarchy's slots, each keeping its place in the reporting order.
        _index = new ScopeIndex(hierarchy);
        foreach (var (book, old) in _reported.ToList())
        {
            var slot = _index.Book(book)!;
            slot.Exposures = old.Exposures;
            _reported[book] = slot;
        }

        foreach (var l in removed)
        {
            _statuses.Remove(l.Id);
        }

        foreach (var l in added)
        {
            _statuses[l.Id] = LimitStatus.Within;
        }

        Install(list);
        retired.AddRange(EvaluateScopes(_limitsByScope.Keys.ToList(), asOf, commit: true));
        return new LimitReloadResult(added, removed, modified, dropped, hierarchyChanged, retired, list.Count);
    }

    /// <summary>The final change of a limit leaving the set, on its scope's current exposure.</summary>
    private LimitStatusChange Ended(LimitDefinition limit, LimitStatus end) =>
        LimitEvaluator.End(limit, _statuses[limit.Id], ExposureOf(limit.Scope, limit.Measure, limit.SpreadGroup), end);

    private IReadOnlyList<LimitScope> CheckBookUpdate(string bookId, BookExposures exposures)
    {
        ArgumentNullException.ThrowIfNull(bookId);
        ArgumentNullException.ThrowIfNull(exposures);
        var scopes = Hierarchy.ScopesCovering(bookId);
        CheckFinite(bookId, exposures);
        return scopes;
    }

    /// <summary>As <see cref="CheckBookUpdate"/>, the same exceptions in the same order, returning the book's slot.</summary>
    private BookSlot CheckBook(string bookId, BookExposures exposures)
    {
        ArgumentNullException.ThrowIfNull(bookId);
        ArgumentNullException.ThrowIfNull(exposures);
        var slot = _index.Book(bookId) ?? throw new KeyNotFoundException($"Book '{bookId}' is not in the book hierarchy.");
        CheckFinite(bookId, exposures);
        return slot;
    }

    private static void CheckFinite(string bookId, BookExposures exposures)
    {
        CheckFinite(bookId, null, exposures.Totals);
        if (exposures.BySpreadGroup.Count > 0) // enumerating an empty dictionary through the interface still allocates
        {
            foreach (var (group, figures) in exposures.BySpreadGroup)
            {
                CheckFinite(bookId, group, figures);
            }
        }
    }

    private static void CheckFinite(string bookId, string? spreadGroup, IReadOnlyDictionary<ExposureMeasure, double> figures)
    {
        if (figures is MeasureFigures array)
        {
            if (array.TryFindNonFinite(out var measure, out var value))
            {
                ThrowNotFinite(bookId, spreadGroup, measure, value);
            }
            return;
        }

        foreach (var (measure, value) in figures)
        {
            if (!double.IsFinite(value))
            {
                ThrowNotFinite(bookId, spreadGroup, measure, value);
            }
        }
    }

    private static void ThrowNotFinite(string bookId, string? spreadGroup, ExposureMeasure measure, double value)
    {
        var where = spreadGroup is null ? "" : $" in spread group '{spreadGroup}'";
        throw new ArgumentOutOfRangeException("figures", value,
            $"Exposure {measure} of book '{bookId}'{where} must be finite, got {value.ToString(CultureInfo.InvariantCulture)}.");
    }

    /// <summary>Stores a book's figures; a book reported for the first time joins the end of the reporting order.</summary>
    private void SetExposures(BookSlot slot, BookExposures exposures)
    {
        if (slot.Exposures is null)
        {
            _reported.Add(slot.Id, slot);
        }

        slot.Exposures = exposures;
    }

    /// <summary>
    /// The sum over <paramref name="books"/> of the measure (a book without figures adds nothing, a missing figure 0), in
    /// the given order. Array-backed totals are read directly; anything else through <see cref="BookExposures.Get"/>.
    /// </summary>
    private static double Sum(BookSlot[] books, ExposureMeasure measure, string? spreadGroup)
    {
        var sum = 0.0;
        foreach (var book in books)
        {
            if (book.Exposures is { } figures)
            {
                sum += spreadGroup is null && figures.Totals is MeasureFigures totals ? totals.ValueOrZero(measure) : figures.Get(measure, spreadGroup);
            }
        }

        return sum;
    }

    /// <summary>Judges the active limits of one scope on its current sum, adding the changes to <paramref name="changes"/>.</summary>
    private void Evaluate(ScopeSlot scope, DateTimeOffset asOf, bool commit, List<LimitStatusChange> changes)
    {
        if (scope.Limits is not { } limits)
        {
            return;
        }

        foreach (var limit in limits)
        {
            if (!limit.IsActiveAt(asOf))
            {
                continue;
            }

            var change = LimitEvaluator.Evaluate(limit, _statuses[limit.Id], Sum(scope.Books, limit.Measure, limit.SpreadGroup));
            if (change is not null)
            {
                changes.Add(change);
                if (commit)
                {
                    _statuses[limit.Id] = change.Current;
                }
            }
        }
    }

    private List<LimitStatusChange> EvaluateScopes(IReadOnlyList<LimitScope> scopes, DateTimeOffset asOf, bool commit)
    {
        var changes = new List<LimitStatusChange>();
        foreach (var scope in scopes)
        {
            if (_limitsByScope.ContainsKey(scope))
            {
                Evaluate(_index.Of(scope), asOf, commit, changes);
            }
        }

        return changes;
    }

    private void Install(List<LimitDefinition> limits)
    {
        _limits.Clear();
        _limitsByScope.Clear();
        foreach (var limit in limits)
        {
            _limits[limit.Id] = limit;
            if (!_limitsByScope.TryGetValue(limit.Scope, out var list))
            {
                _limitsByScope[limit.Scope] = list = [];
            }

            list.Add(limit);
        }

        _index.AttachLimits(_limitsByScope);
    }

    private static void ThrowIfInvalid(BookHierarchy hierarchy, List<LimitDefinition> limits)
    {
        var errors = new List<string>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var limit in limits)
        {
            if (limit is null)
            {
                errors.Add("a limit definition is null; remove it");
                continue;
            }

            errors.AddRange(limit.Validate().Select(e => e.ToString()));
            if (limit.Id is not null && !seen.Add(limit.Id))
            {
                errors.Add($"limit '{limit.Id}' Id: \"{limit.Id}\" is used twice; give each limit its own id");
            }

            if (!string.IsNullOrWhiteSpace(limit.Scope.Id) && !hierarchy.Contains(limit.Scope))
            {
                errors.Add($"limit '{limit.Id}' Scope: {limit.Scope} is not in the book hierarchy; add the {limit.Scope.Level.ToString().ToLowerInvariant()} to the hierarchy or fix the scope id");
            }
        }

        if (errors.Count > 0)
        {
            throw new LimitConfigurationException(errors);
        }
    }
}
