namespace Monitor.Limits;

/// <summary>
/// One scope of the hierarchy as <see cref="LimitSet"/> judges it: its books in the hierarchy's order (the order its
/// exposure is summed in), the limits defined on it, and a mark so that a batch judges it once.
/// </summary>
internal sealed class ScopeSlot(LimitScope scope)
{
    public LimitScope Scope { get; } = scope;

    /// <summary>The books whose figures add up to this scope's exposure; set once by <see cref="ScopeIndex"/>.</summary>
    public BookSlot[] Books { get; set; } = [];

    /// <summary>The limits on this scope in definition order, or null when it has none.</summary>
    public List<LimitDefinition>? Limits { get; set; }

    /// <summary>The last batch that judged this scope (<see cref="LimitSet.UpdateBooks"/>).</summary>
    public long Mark { get; set; }
}
