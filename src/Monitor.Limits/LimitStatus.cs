namespace Monitor.Limits;

/// <summary>
/// Our own status names, ordered by severity (the numeric order is used for comparisons):
/// within the warning level, at or above the warning level, at or above the hard limit.
/// </summary>
public enum LimitStatus
{
    Within = 0,
    Warning = 1,
    Breach = 2,
}
