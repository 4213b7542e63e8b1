using Monitor.Analytics.Fitting;

namespace Monitor.Service.Engine;

/// <summary>What the engine needs to know beyond its inputs: the valuation date, the fit settings and the quality gates.</summary>
public sealed record EngineSettings
{
    /// <summary>
    /// The date positions are valued at and curve time starts from: the spot (settlement) date of the
    /// government bonds for today's trade date. Bonds with another lag are fitted from their own
    /// settlement date, a day or two apart (common practice, no source).
    /// </summary>
    public required DateOnly ValuationDate { get; init; }

    public CurveFitOptions BaseFit { get; init; } = new() { Model = CurveModel.NelsonSiegel };

    public CurveFitOptions SpreadFit { get; init; } = new() { Model = CurveModel.NelsonSiegel };

    public FitQualityGate BaseGate { get; init; } = new(MaxRmseBp: 5, MaxAbsErrorBp: 25, MinInstruments: 6);

    public FitQualityGate SpreadGate { get; init; } = new(MaxRmseBp: 15, MaxAbsErrorBp: 60, MinInstruments: 4);

    /// <summary>The currency of every figure; a bond in another is refused (null: no check, for tests of the analytics).</summary>
    public string? ReportingCurrency { get; init; }

    /// <summary>
    /// How far ahead of the business clock a quote may be stamped (clock skew between the feed and us); a quote stamped
    /// further ahead is refused. Default 5 s.
    /// </summary>
    public TimeSpan QuoteClockTolerance { get; init; } = TimeSpan.FromSeconds(5);

    /// <summary>What fits the valuation government curve; the other source fits a reference curve (<see cref="ValuationCurveSource"/>).</summary>
    public ValuationCurveSource ValuationCurveSource { get; init; } = ValuationCurveSource.BondQuotes;

    /// <summary>A quote older than this when a curve is fitted is left out as stale.</summary>
    public TimeSpan StaleAfter { get; init; } = TimeSpan.FromHours(4);
}
