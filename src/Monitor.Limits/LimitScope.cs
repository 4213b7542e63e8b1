using System.Globalization;

namespace Monitor.Limits;

/// <summary>A scope level and the id of the firm, desk or book at that level.</summary>
public readonly record struct LimitScope(LimitScopeLevel Level, string Id)
{
    public static LimitScope Firm(string firmId) => new(LimitScopeLevel.Firm, firmId);

    public static LimitScope Desk(string deskId) => new(LimitScopeLevel.Desk, deskId);

    public static LimitScope Book(string bookId) => new(LimitScopeLevel.Book, bookId);

    /// <summary>"desk:rates", "book:govt-short", "firm:acme".</summary>
    public override string ToString() =>
        string.Create(CultureInfo.InvariantCulture, $"{Level.ToString().ToLowerInvariant()}:{Id}");
}
