namespace Monitor.Limits;

/// <summary>
/// What a configuration reload changed: limits added, removed and modified (same id, different
/// definition), books whose exposures were dropped because the new hierarchy no longer lists them,
/// and the status changes it produced: first one change to <see cref="LimitStatus.Retired"/> per removed
/// limit, then those of re-evaluating against the current exposures. <see cref="LimitCount"/> is the
/// number of limits in force after the reload.
/// </summary>
public sealed record LimitReloadResult(
    IReadOnlyList<LimitDefinition> Added,
    IReadOnlyList<LimitDefinition> Removed,
    IReadOnlyList<LimitModification> Modified,
    IReadOnlyList<string> DroppedBooks,
    bool HierarchyChanged,
    IReadOnlyList<LimitStatusChange> StatusChanges,
    int LimitCount)
{
    /// <summary>True when the reload changed nothing at all.</summary>
    public bool IsEmpty => Added.Count == 0 && Removed.Count == 0 && Modified.Count == 0 && DroppedBooks.Count == 0 && !HierarchyChanged;

    /// <summary>
    /// Why a risk officer should look at this reload: it removes every limit, or it removes a limit that stood at warning
    /// or breach (which ends that warning or breach by configuration, not by the exposure). Empty when neither.
    /// </summary>
    public IReadOnlyList<string> Flags
    {
        get
        {
            var flags = new List<string>();
            if (LimitCount == 0 && Removed.Count > 0)
            {
                flags.Add($"removes every limit ({Removed.Count}); no book, desk or firm is judged until limits are given again");
            }
            foreach (var change in StatusChanges.Where(c => c.Current == LimitStatus.Retired && c.Previous is LimitStatus.Warning or LimitStatus.Breach))
            {
                flags.Add($"removes limit '{change.LimitId}' while it stands at {change.Previous.ToString().ToLowerInvariant()}");
            }
            return flags;
        }
    }
}
