namespace Monitor.Limits;

/// <summary>
/// What a configuration reload changed: limits added, removed and modified (same id, different
/// definition), books whose exposures were dropped because the new hierarchy no longer lists them,
/// and the status changes that re-evaluating against the current exposures produced.
/// </summary>
public sealed record LimitReloadResult(
    IReadOnlyList<LimitDefinition> Added,
    IReadOnlyList<LimitDefinition> Removed,
    IReadOnlyList<LimitModification> Modified,
    IReadOnlyList<string> DroppedBooks,
    bool HierarchyChanged,
    IReadOnlyList<LimitStatusChange> StatusChanges)
{
    /// <summary>True when the reload changed nothing at all.</summary>
    public bool IsEmpty => Added.Count == 0 && Removed.Count == 0 && Modified.Count == 0 && DroppedBooks.Count == 0 && !HierarchyChanged;
}
