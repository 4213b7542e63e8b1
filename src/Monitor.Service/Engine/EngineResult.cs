using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>Everything one input changed: curves refitted, books recomputed, limit statuses changed.</summary>
public sealed class EngineResult
{
    public List<CurveFitOutcome> Curves { get; } = [];

    public List<BookUpdate> Books { get; } = [];

    public List<LimitStatusChange> StatusChanges { get; } = [];

    /// <summary>For trades: what the message did.</summary>
    public TradeOutcome? Trade { get; set; }

    /// <summary>Curves and versions the figures were computed on, e.g. "government v4, UTIL-A v2".</summary>
    public string CurvesUsed { get; set; } = string.Empty;

    /// <summary>Milliseconds spent recomputing books.</summary>
    public double ExposureMilliseconds { get; set; }

    /// <summary>Books holding a spread group without a good fit yet: valued on stand-in spreads, their figures provisional.</summary>
    public List<string> BooksAwaitingCurves { get; } = [];
}
