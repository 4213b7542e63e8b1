namespace Monitor.Limits;

/// <summary>
/// The firm &gt; desk &gt; book tree: every book belongs to exactly one desk, every desk to the firm.
/// Immutable; a configuration reload builds a new one.
/// </summary>
public sealed class BookHierarchy
{
    private readonly Dictionary<string, string> _deskByBook;
    private readonly Dictionary<string, IReadOnlyList<string>> _booksByDesk;

    /// <param name="firmId">Id of the firm scope.</param>
    /// <param name="booksByDesk">Desk id -&gt; its book ids. A desk may have no books yet.</param>
    /// <exception cref="ArgumentException">Empty ids, or a book listed under two desks (the message names both).</exception>
    public BookHierarchy(string firmId, IReadOnlyDictionary<string, IReadOnlyList<string>> booksByDesk)
    {
        ArgumentNullException.ThrowIfNull(booksByDesk);
        if (string.IsNullOrWhiteSpace(firmId))
        {
            throw new ArgumentException($"Firm id must not be empty, got '{firmId}'.", nameof(firmId));
        }

        FirmId = firmId;
        _deskByBook = new Dictionary<string, string>(StringComparer.Ordinal);
        _booksByDesk = new Dictionary<string, IReadOnlyList<string>>(StringComparer.Ordinal);
        foreach (var (desk, books) in booksByDesk)
        {
            if (string.IsNullOrWhiteSpace(desk))
            {
                throw new ArgumentException($"Desk id must not be empty, got '{desk}'.", nameof(booksByDesk));
            }

            foreach (var book in books)
            {
                if (string.IsNullOrWhiteSpace(book))
                {
                    throw new ArgumentException($"Book id under desk '{desk}' must not be empty, got '{book}'.", nameof(booksByDesk));
                }

                if (_deskByBook.TryGetValue(book, out var other))
                {
                    throw new ArgumentException($"Book '{book}' is listed under desk '{other}' and desk '{desk}'; a book belongs to one desk.", nameof(booksByDesk));
                }

                _deskByBook[book] = desk;
            }

            _booksByDesk[desk] = books.ToArray();
        }
    }

    public string FirmId { get; }

    public IEnumerable<string> Desks => _booksByDesk.Keys;

    public IEnumerable<string> Books => _deskByBook.Keys;

    public bool ContainsBook(string bookId) => _deskByBook.ContainsKey(bookId);

    public bool ContainsDesk(string deskId) => _booksByDesk.ContainsKey(deskId);

    /// <exception cref="KeyNotFoundException">Unknown book; the message names it.</exception>
    public string DeskOf(string bookId) =>
        _deskByBook.TryGetValue(bookId, out var desk) ? desk : throw new KeyNotFoundException($"Book '{bookId}' is not in the book hierarchy.");

    /// <exception cref="KeyNotFoundException">Unknown desk; the message names it.</exception>
    public IReadOnlyList<string> BooksOf(string deskId) =>
        _booksByDesk.TryGetValue(deskId, out var books) ? books : throw new KeyNotFoundException($"Desk '{deskId}' is not in the book hierarchy.");

    /// <summary>True when the scope names this firm, a known desk or a known book.</summary>
    public bool Contains(LimitScope scope) => scope.Level switch
    {
        LimitScopeLevel.Firm => string.Equals(scope.Id, FirmId, StringComparison.Ordinal),
        LimitScopeLevel.Desk => ContainsDesk(scope.Id),
        LimitScopeLevel.Book => ContainsBook(scope.Id),
        _ => false,
    };

    /// <summary>The scopes whose exposure a change in this book moves: the book, its desk, the firm.</summary>
    public IReadOnlyList<LimitScope> ScopesCovering(string bookId) =>
        [LimitScope.Book(bookId), LimitScope.Desk(DeskOf(bookId)), LimitScope.Firm(FirmId)];

    /// <summary>The books whose exposures add up to the scope's exposure.</summary>
    public IReadOnlyList<string> BooksUnder(LimitScope scope) => scope.Level switch
    {
        LimitScopeLevel.Firm when Contains(scope) => _deskByBook.Keys.ToArray(),
        LimitScopeLevel.Desk => BooksOf(scope.Id),
        LimitScopeLevel.Book when ContainsBook(scope.Id) => [scope.Id],
        _ => throw new KeyNotFoundException($"Scope '{scope}' is not in the book hierarchy."),
    };

    /// <summary>Same firm id, same desks and the same books under each desk (order ignored).</summary>
    public bool SameTreeAs(BookHierarchy other)
    {
        ArgumentNullException.ThrowIfNull(other);
        return FirmId == other.FirmId
            && _booksByDesk.Count == other._booksByDesk.Count
            && _deskByBook.Count == other._deskByBook.Count
            && _deskByBook.All(kv => other._deskByBook.TryGetValue(kv.Key, out var d) && d == kv.Value)
            && _booksByDesk.Keys.All(other._booksByDesk.ContainsKey);
    }
}
