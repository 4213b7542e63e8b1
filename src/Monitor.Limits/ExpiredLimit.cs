namespace Monitor.Limits;

/// <summary>A temporary limit that reached its expiry and was removed, with the status it had last.</summary>
public sealed record ExpiredLimit(LimitDefinition Limit, LimitStatus LastStatus);
