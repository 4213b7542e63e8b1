using Microsoft.Extensions.Options;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Fitting;
using Monitor.Files;
using Monitor.Files.Csv;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;

namespace Monitor.Service.Hosting;

/// <summary>
/// Builds the engine at start-up from the configured files: limits (and the book hierarchy), instruments and
/// start-of-day positions. Any problem stops the start with a message naming the key, the file and the fix.
/// </summary>
public static class EngineFactory
{
    public static RiskEngine Create(MonitorOptions options, TimeProvider time)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(time);
        var limits = ReadLimits(options.LimitsFile);
        var engine = new RiskEngine(Settings(options, time), limits);
        IReadOnlyList<Analytics.Instruments.Bond> bonds;
        try
        {
            bonds = InstrumentFile.Read(options.InstrumentsFile, options.ReportingCurrency);
        }
        catch (CsvFileException ex)
        {
            throw new OptionsValidationException(MonitorOptions.SectionName, typeof(MonitorOptions), [$"Monitor:InstrumentsFile: {ex.Message}"]);
        }
        foreach (var bond in bonds)
        {
            engine.DefineInstrument(bond);
        }
        if (!string.IsNullOrWhiteSpace(options.PositionsFile))
        {
            LoadPositions(engine, options.PositionsFile);
        }
        return engine;
    }

    public static EngineSettings Settings(MonitorOptions options, TimeProvider time) => new()
    {
        ValuationDate = options.ValuationDate ?? SpotDate(options.BusinessDay.ToRoll().BusinessDateOf(time.GetUtcNow())),
        BaseFit = new CurveFitOptions { Model = options.BaseCurveModel },
        SpreadFit = new CurveFitOptions { Model = CurveModel.NelsonSiegel },
        BaseGate = new FitQualityGate(options.BaseMaxRmseBp, options.BaseMaxErrorBp, options.BaseMinQuotes),
        SpreadGate = new FitQualityGate(options.SpreadMaxRmseBp, options.SpreadMaxErrorBp, options.SpreadMinQuotes),
        StaleAfter = options.StaleQuoteAfter,
        ReportingCurrency = options.ReportingCurrency,
        QuoteClockTolerance = options.QuoteClockTolerance,
        ValuationCurveSource = options.ValuationCurveSource,
    };

    /// <summary>Spot date for a trade date: one business day later (weekends only; holiday calendars per currency are future work).</summary>
    public static DateOnly SpotDate(DateOnly tradeDate) => BusinessCalendar.WeekendsOnly.SettlementDate(tradeDate, 1);

    private static LimitsConfiguration ReadLimits(string path)
    {
        try
        {
            return LimitsFileParser.Parse(File.ReadAllText(path));
        }
        catch (LimitConfigurationException ex)
        {
            throw new OptionsValidationException(MonitorOptions.SectionName, typeof(MonitorOptions), [$"Monitor:LimitsFile '{path}': {ex.Message}"]);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // With no good limits there is nothing to judge the books by: the start stops (exit 2), naming the file and the fix.
            throw new OptionsValidationException(MonitorOptions.SectionName, typeof(MonitorOptions),
                [$"Monitor:LimitsFile: cannot read '{path}' ({ex.Message}); make it a limits file the service can read, or point the key at one."]);
        }
    }

    private static void LoadPositions(RiskEngine engine, string path)
    {
        IReadOnlyList<PositionRecord> rows;
        try
        {
            rows = PositionFile.Read(path);
        }
        catch (CsvFileException ex)
        {
            throw new OptionsValidationException(MonitorOptions.SectionName, typeof(MonitorOptions), [$"Monitor:PositionsFile: {ex.Message}"]);
        }
        for (var i = 0; i < rows.Count; i++)
        {
            try
            {
                engine.LoadPosition(rows[i].Book, rows[i].InstrumentId, rows[i].FaceAmount);
            }
            catch (MessageRejectedException ex)
            {
                throw new OptionsValidationException(MonitorOptions.SectionName, typeof(MonitorOptions),
                    [$"Monitor:PositionsFile: {path}, data row {i + 1}: {ex.Message}"]);
            }
        }
    }
}
