namespace Monitor.Limits;

/// <summary>
/// Our own status names. <see cref="Within"/>, <see cref="Warning"/> and <see cref="Breach"/> are ordered by severity
/// (the numeric order is used for comparisons): within the warning level, at or above the warning level, at or above the
/// hard limit. <see cref="Retired"/> and <see cref="Expired"/> are end states, not severities: the limit was taken out
/// by a reload of the limits file, or a temporary limit reached its <c>expiresAt</c>; it is no longer judged.
/// </summary>
public enum LimitStatus
{
    Within = 0,
    Warning = 1,
    Breach = 2,
    Retired = 3,
    Expired = 4,
}
