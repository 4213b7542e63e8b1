namespace Monitor.Limits;

/// <summary>The content of a limits file: the book hierarchy and the limit definitions, already validated.</summary>
public sealed record LimitsConfiguration(BookHierarchy Hierarchy, IReadOnlyList<LimitDefinition> Limits)
{
    /// <summary>A fresh <see cref="LimitSet"/> over this configuration, every limit Within.</summary>
    public LimitSet CreateLimitSet() => new(Hierarchy, Limits);
}
