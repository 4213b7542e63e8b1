namespace Monitor.Limits;

/// <summary>
/// A <see cref="BookHierarchy"/> laid out for <see cref="LimitSet"/>: a slot per book, desk and the firm, each scope
/// with its books in the order <see cref="BookHierarchy.BooksUnder"/> lists them, so sums come out bit for bit the
/// same. Built with each hierarchy (which is immutable); a reload builds a new one.
/// </summary>
internal sealed class ScopeIndex
{
    private readonly BookHierarchy _hierarchy;
    private readonly Dictionary<string, BookSlot> _books = new(StringComparer.Ordinal);
    private readonly Dictionary<string, ScopeSlot> _desks = new(StringComparer.Ordinal);

    public ScopeIndex(BookHierarchy hierarchy)
    {
        _hierarchy = hierarchy;
        foreach (var book in hierarchy.Books)
        {
            _books[book] = new BookSlot(book);
        }
        foreach (var desk in hierarchy.Desks)
        {
            var members = hierarchy.BooksOf(desk);
            var slot = new ScopeSlot(LimitScope.Desk(desk)) { Books = new BookSlot[members.Count] };
            for (var i = 0; i < members.Count; i++)
            {
                slot.Books[i] = _books[members[i]];
                slot.Books[i].Desk = slot;
            }
            _desks[desk] = slot;
        }
        Firm = new ScopeSlot(LimitScope.Firm(hierarchy.FirmId)) { Books = [.. _books.Values] };
    }

    public ScopeSlot Firm { get; }

    public BookSlot? Book(string bookId) => _books.GetValueOrDefault(bookId);

    /// <summary>The scope's slot; throws as <see cref="BookHierarchy.BooksUnder"/> does for a scope not in the hierarchy.</summary>
    public ScopeSlot Of(LimitScope scope) => scope.Level switch
    {
        LimitScopeLevel.Firm when _hierarchy.Contains(scope) => Firm,
        LimitScopeLevel.Desk => _desks.TryGetValue(scope.Id, out var desk) ? desk : Throw(scope),
        LimitScopeLevel.Book when _books.TryGetValue(scope.Id, out var book) => book.Own,
        _ => Throw(scope),
    };

    /// <summary>Hangs each scope's limits on its slot (after every install of definitions).</summary>
    public void AttachLimits(Dictionary<LimitScope, List<LimitDefinition>> limitsByScope)
    {
        Firm.Limits = null;
        foreach (var desk in _desks.Values)
        {
            desk.Limits = null;
        }
        foreach (var book in _books.Values)
        {
            book.Own.Limits = null;
        }
        foreach (var (scope, limits) in limitsByScope)
        {
            Of(scope).Limits = limits;
        }
    }

    private ScopeSlot Throw(LimitScope scope)
    {
        if (scope.Level == LimitScopeLevel.Desk)
        {
            _hierarchy.BooksOf(scope.Id); // throws with the hierarchy's own message
        }
        throw new KeyNotFoundException($"Scope '{scope}' is not in the book hierarchy.");
    }
}
