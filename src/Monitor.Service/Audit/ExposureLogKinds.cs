namespace Monitor.Service.Audit;

/// <summary>
/// Record kinds used by the service. Any name matching <c>[a-z][a-z0-9-]*</c> (at most 64 characters)
/// is accepted; these are the ones the service writes.
/// </summary>
public static class ExposureLogKinds
{
    /// <summary>Exposures of a book (periodic, on a status change, or at end of day).</summary>
    public const string Snapshot = "snapshot";

    /// <summary>A limit status changed.</summary>
    public const string StatusChange = "status-change";

    /// <summary>The limit file was reloaded.</summary>
    public const string LimitsReloaded = "limits-reloaded";

    /// <summary>A curve was fitted and accepted.</summary>
    public const string CurveFitted = "curve-fitted";

    /// <summary>A curve fit failed the quality gate; the last good curve stays.</summary>
    public const string CurveRejected = "curve-rejected";

    /// <summary>A trade changed a book.</summary>
    public const string TradeApplied = "trade-applied";

    /// <summary>End of the business day.</summary>
    public const string DayEnd = "day-end";

    /// <summary>A journal line or trade lost at start and let through by <c>Journal:AcceptLoss</c> (one record per loss).</summary>
    public const string JournalLoss = "journal-loss";

    /// <summary>Written by the writer itself: a torn last line (crash mid-write) was cut off at start.</summary>
    public const string LogRepaired = "log-repaired";
}
