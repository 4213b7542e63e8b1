using Monitor.Analytics.Fitting;

namespace Monitor.Service.Hosting;

/// <summary>Configuration section <c>Monitor</c>: the start-of-day files, the valuation date, curve models, gates and timings.</summary>
public sealed class MonitorOptions
{
    public const string SectionName = "Monitor";

    /// <summary>Instruments file (our CSV format, config/examples/README.md). Required.</summary>
    public string InstrumentsFile { get; set; } = string.Empty;

    /// <summary>Start-of-day positions file; optional (books start flat without it).</summary>
    public string? PositionsFile { get; set; }

    /// <summary>Limits file (JSON, src/Monitor.Limits/README.md). Required; reloaded when it changes.</summary>
    public string LimitsFile { get; set; } = string.Empty;

    /// <summary>Optional quotes to fit the opening curves from before the first message.</summary>
    public string? OpeningQuotesFile { get; set; }

    /// <summary>
    /// The currency every figure is in (ISO 4217 code). Until several currencies are supported, a bond in any other
    /// currency is refused: in the instruments file (the start stops), in InstrumentDefined, and trades and quotes on
    /// it. Default XTS, the ISO 4217 code reserved for testing that the example files use: set your books' currency.
    /// </summary>
    public string ReportingCurrency { get; set; } = "XTS";

    /// <summary>Valuation (spot) date; default the next business day after today's business date (<see cref="BusinessDay"/>).</summary>
    public DateOnly? ValuationDate { get; set; }

    /// <summary>When the business day rolls (time of day and IANA time zone); default midnight UTC.</summary>
    public BusinessDayOptions BusinessDay { get; set; } = new();

    /// <summary>Model of the government curve: NelsonSiegel (default) or Svensson. Spread curves are always Nelson-Siegel.</summary>
    public CurveModel BaseCurveModel { get; set; } = CurveModel.NelsonSiegel;

    /// <summary>
    /// Shortest time between the starts of two refits. A quote after a quiet spell is fitted at once; during a burst
    /// the quotes that arrive within the window are fitted together on the latest of each. Default 20 ms.
    /// </summary>
    public TimeSpan ConflationWindow { get; set; } = TimeSpan.FromMilliseconds(20);

    /// <summary>
    /// Book figures are sent at most once per book per interval, the newest figures winning, in BookExposuresBatch
    /// messages; 0 sends each change's books at once. Limit and curve events are never held back. Default 1 s.
    /// </summary>
    public TimeSpan BookEventInterval { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>Period of book snapshots in the exposure log; 0 turns them off. Default 5 minutes.</summary>
    public TimeSpan SnapshotInterval { get; set; } = TimeSpan.FromMinutes(5);

    /// <summary>
    /// What fits the government curve the books are valued on: BondQuotes (default; par yields then fit the reference
    /// curve government-par) or ParYields (government bond quotes then fit the reference curve government-bonds).
    /// </summary>
    public Engine.ValuationCurveSource ValuationCurveSource { get; set; } = Engine.ValuationCurveSource.BondQuotes;

    /// <summary>
    /// How far ahead of the service's clock a quote may be stamped; one stamped further ahead is refused (to the error
    /// queue, naming quoteTime), so a bad stamp never outranks the good quotes after it. Default 5 s.
    /// </summary>
    public TimeSpan QuoteClockTolerance { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>Quotes older than this are left out of fits as stale. Default 4 hours.</summary>
    public TimeSpan StaleQuoteAfter { get; set; } = TimeSpan.FromHours(4);

    /// <summary>Government curve quality gate: largest RMSE in bp of yield. Default 5.</summary>
    public double BaseMaxRmseBp { get; set; } = 5;

    /// <summary>Government curve quality gate: largest single residual in bp. Default 25.</summary>
    public double BaseMaxErrorBp { get; set; } = 25;

    /// <summary>Government curve quality gate: fewest bonds in a fit. Default 6.</summary>
    public int BaseMinQuotes { get; set; } = 6;

    /// <summary>Spread curve quality gate: largest RMSE in bp. Default 15.</summary>
    public double SpreadMaxRmseBp { get; set; } = 15;

    /// <summary>Spread curve quality gate: largest single residual in bp. Default 60.</summary>
    public double SpreadMaxErrorBp { get; set; } = 60;

    /// <summary>Spread curve quality gate: fewest bonds in a fit. Default 4.</summary>
    public int SpreadMinQuotes { get; set; } = 4;
}
