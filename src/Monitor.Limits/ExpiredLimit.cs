namespace Monitor.Limits;

/// <summary>
/// A temporary limit that reached its expiry and was removed, with the status it had last and its final status change
/// (to <see cref="LimitStatus.Expired"/>, on the scope's exposure at that time).
/// </summary>
public sealed record ExpiredLimit(LimitDefinition Limit, LimitStatus LastStatus, LimitStatusChange Change);
