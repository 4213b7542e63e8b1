namespace Monitor.Limits;

/// <summary>Where a limit applies, from widest to narrowest: the firm covers every desk, a desk covers its books.</summary>
public enum LimitScopeLevel
{
    /// <summary>Every book of the firm.</summary>
    Firm,

    /// <summary>The books of one desk.</summary>
    Desk,

    /// <summary>One book.</summary>
    Book,
}
