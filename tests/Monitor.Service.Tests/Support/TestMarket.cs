using System.Globalization;
using Monitor.Analytics.Market;
using Monitor.Files;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;

namespace Monitor.Service.Tests.Support;

/// <summary>
/// The invented example market of config/examples (copied into Data/): valuation date 2026-06-02 (spot for
/// trade date 2026-06-01), opening quotes at 08:00Z and closing quotes at 16:30Z, and the clock at 17:00Z.
/// </summary>
public static class TestMarket
{
    public static readonly DateOnly ValuationDate = new(2026, 6, 2);

    public static readonly DateTimeOffset Now = new(2026, 6, 1, 17, 0, 0, TimeSpan.Zero);

    public static string Data(string name) => Path.Combine(AppContext.BaseDirectory, "Data", name);

    public static MonitorOptions Options(string? limitsFile = null) => new()
    {
        InstrumentsFile = Data("instruments.csv"),
        PositionsFile = Data("positions.csv"),
        LimitsFile = limitsFile ?? Data("limits.json"),
        ValuationDate = ValuationDate,
        StaleQuoteAfter = TimeSpan.FromHours(12),
    };

    public static RiskEngine Engine(string? limitsFile = null) => EngineFactory.Create(Options(limitsFile), new ManualClock(Now));

    public static IReadOnlyList<BondQuote> OpenQuotes() => QuoteFile.Read(Data("quotes-open.csv"));

    public static IReadOnlyList<BondQuote> CloseQuotes() => QuoteFile.Read(Data("quotes-close.csv"));

    /// <summary>An engine with the opening curves fitted.</summary>
    public static RiskEngine OpenedEngine(string? limitsFile = null)
    {
        var engine = Engine(limitsFile);
        foreach (var q in OpenQuotes())
        {
            engine.AcceptQuote(q, Now);
        }
        engine.RefitDirtyCurves(Now);
        return engine;
    }

    /// <summary>Every quote of <paramref name="quotes"/> at mid + <paramref name="priceShift"/>, stamped <paramref name="time"/>.</summary>
    public static IReadOnlyList<BondQuote> Shifted(IReadOnlyList<BondQuote> quotes, double priceShift, DateTimeOffset time) =>
        quotes.Select(q => new BondQuote(q.InstrumentId, time, null, null, q.CleanMid!.Value + priceShift, null, "test")).ToArray();

    /// <summary>Quotes moved a fraction <paramref name="f"/> of the way from open to close (f may exceed 1).</summary>
    public static IReadOnlyList<BondQuote> Between(double f, DateTimeOffset time)
    {
        var close = CloseQuotes().ToDictionary(q => q.InstrumentId, StringComparer.Ordinal);
        return OpenQuotes().Select(o => new BondQuote(o.InstrumentId, time, null, null,
            o.CleanMid!.Value + f * (close[o.InstrumentId].CleanMid!.Value - o.CleanMid!.Value), null, "test")).ToArray();
    }

    /// <summary>A limits file like Data/limits.json with extra book limits, written to <paramref name="folder"/>.</summary>
    public static string WriteLimits(string folder, params string[] extraLimits)
    {
        var text = File.ReadAllText(Data("limits.json"));
        var marker = "\"limits\": [";
        var index = text.IndexOf(marker, StringComparison.Ordinal) + marker.Length;
        var extra = string.Concat(extraLimits.Select(l => "\n    " + l + ","));
        var path = Path.Combine(folder, "limits-" + Guid.NewGuid().ToString("N")[..8] + ".json");
        File.WriteAllText(path, text.Insert(index, extra));
        return path;
    }

    public static string Inv(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
