using Monitor.Analytics.Market;
using Monitor.Files;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Builds engines the way the service does (EngineFactory.Create from the start-of-day files), over the invented
/// example market copied into Data/journal (see its README.md): valuation date 2026-06-02, close quotes of 2026-06-01.
/// </summary>
internal static class JournalTestEngine
{
    public static readonly DateOnly ValuationDate = new(2026, 6, 2);

    /// <summary>After the 16:30Z close quotes of 2026-06-01, well inside their 4-hour staleness window.</summary>
    public static readonly DateTimeOffset Now = new(2026, 6, 1, 17, 0, 0, TimeSpan.Zero);

    public static string DataFile(string name) => Path.Combine(AppContext.BaseDirectory, "Data", "journal", name);

    public static RiskEngine Create() => EngineFactory.Create(new MonitorOptions
    {
        InstrumentsFile = DataFile("instruments.csv"),
        PositionsFile = DataFile("positions.csv"),
        LimitsFile = DataFile("limits.json"),
        ValuationDate = ValuationDate,
    }, new ManualClock(Now));

    /// <summary>
    /// The close quotes without the UTIL-A group: it has 3 bonds, and RiskEngine.RefitDirtyCurves throws
    /// (ArgumentException from the fitter: "needs at least 4 usable points") instead of refusing the fit. Reported to the lead.
    /// </summary>
    public static IReadOnlyList<BondQuote> CloseQuotes() =>
        QuoteFile.Read(DataFile("quotes-close.csv")).Where(q => !UtilA.Contains(q.InstrumentId)).ToArray();

    private static readonly string[] UtilA = ["QFU-2029-03", "QFU-2033-09", "SRT-2031-06"];

    /// <summary>An engine with the close quotes accepted and the curves fitted.</summary>
    public static RiskEngine CreateFitted()
    {
        var engine = Create();
        foreach (var quote in CloseQuotes())
        {
            engine.AcceptQuote(quote, Now);
        }
        engine.RefitDirtyCurves(Now);
        return engine;
    }

    public static TradeInput Trade(string id, int version, TradeAction action, string book, string instrument, double face, double price = 99.5) =>
        new(id, version, action, book, instrument, face, price, Now.AddMinutes(-version));
}
