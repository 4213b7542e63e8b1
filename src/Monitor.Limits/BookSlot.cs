namespace Monitor.Limits;

/// <summary>
/// One book of the hierarchy inside <see cref="LimitSet"/>: its own scope, its desk's scope and its last reported
/// figures (null until the first report). Holding these per book spares a batch of a thousand books the per-book
/// scope lists, hash lookups by scope and book lists that the generic path builds.
/// </summary>
internal sealed class BookSlot
{
    public BookSlot(string id)
    {
        Id = id;
        Own = new ScopeSlot(LimitScope.Book(id)) { Books = [this] };
    }

    public string Id { get; }

    public ScopeSlot Own { get; }

    public ScopeSlot Desk { get; set; } = null!;

    public BookExposures? Exposures { get; set; }
}
