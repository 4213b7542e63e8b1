namespace Monitor.Limits;

/// <summary>A limit's current standing: its status, the scope's exposure, the bound on that side and the utilisation.</summary>
public sealed record LimitUse(LimitDefinition Limit, LimitStatus Status, double Exposure, double? Bound, double Utilisation);
