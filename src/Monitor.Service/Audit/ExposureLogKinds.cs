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

    /// <summary>An instrument was defined or redefined by message: <c>instrumentId</c>, <c>previous</c> (null when new) and <c>definition</c>.</summary>
    public const string InstrumentDefined = "instrument-defined";

    /// <summary>A trade changed a book.</summary>
    public const string TradeApplied = "trade-applied";

    /// <summary>A book's figures at the business day's close (the roll passing while the service runs), one per valued book.</summary>
    public const string CloseSnapshot = "close-snapshot";

    /// <summary>The business day closed: written once at the roll, after its close snapshots; what a checkpoint anchors.</summary>
    public const string DayClosed = "day-closed";

    /// <summary>A book's figures when the service stops (any time of day), one per valued book.</summary>
    public const string StopSnapshot = "stop-snapshot";

    /// <summary>The service stopped (intraday or not): written once, after its stop snapshots. Not a day's close.</summary>
    public const string ServiceStopped = "service-stopped";

    /// <summary>A journal line or trade lost at start and let through by <c>Journal:AcceptLoss</c> (one record per loss).</summary>
    public const string JournalLoss = "journal-loss";

    /// <summary>Written by the writer itself: a torn last line (crash mid-write) was cut off at start.</summary>
    public const string LogRepaired = "log-repaired";
}
