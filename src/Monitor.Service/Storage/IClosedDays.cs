namespace Monitor.Service.Storage;

/// <summary>
/// Which past business days are closed, i.e. safe to archive: their records are final and anchored. Retention never
/// moves a day this does not vouch for. The day's checkpoint, once written (issue 10 point 1), is the evidence to use.
/// </summary>
public interface IClosedDays
{
    /// <summary>True when <paramref name="day"/> is closed; <paramref name="why"/> says what is missing when it is not.</summary>
    bool IsClosed(DateOnly day, out string why);
}
