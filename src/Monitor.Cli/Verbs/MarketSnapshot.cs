using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Analytics.Risk;
using Monitor.Files;

namespace Monitor.Cli.Verbs;

/// <summary>
/// One quotes file read against the instruments: the newest quote per instrument, the valuation date, each usable
/// quote priced (<see cref="BondFitInputs"/>, as the service does) and grouped by curve key, and the quotes left out
/// with their reason: unknown instrument, matured, stale (older than the stale limit before the newest quote of the
/// file), invalid (no yield for the price). Fits the government curve, then spread curves over it.
/// </summary>
internal sealed class MarketSnapshot
{
    private readonly Dictionary<string, List<PricedBondQuote>> _usable = new(StringComparer.Ordinal);
    private readonly Dictionary<string, List<FitExclusion>> _excluded = new(StringComparer.Ordinal);

    private MarketSnapshot(string quotesPath, DateOnly valuationDate, DateTimeOffset asOf)
    {
        QuotesPath = quotesPath;
        ValuationDate = valuationDate;
        AsOf = asOf;
    }

    public string QuotesPath { get; }

    public DateOnly ValuationDate { get; }

    /// <summary>Time of the newest quote in the file: "now" for the stale test.</summary>
    public DateTimeOffset AsOf { get; }

    /// <summary>Spread groups with at least one quote (usable or not), in name order.</summary>
    public IEnumerable<string> QuotedSpreadGroups =>
        _usable.Keys.Concat(_excluded.Keys).Where(k => !CurveKey.IsGovernment(k)).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal);

    /// <summary>
    /// Reads <paramref name="quotesPath"/>. Valuation date: <paramref name="valuationDate"/>, or the spot date (T+1
    /// business day, weekends only) of the UTC date of the earliest quote.
    /// </summary>
    public static MarketSnapshot Load(IReadOnlyDictionary<string, Bond> instruments, string quotesPath, DateOnly? valuationDate, TimeSpan staleAfter)
    {
        var quotes = QuoteFile.Read(quotesPath);
        if (quotes.Count == 0)
        {
            throw new CliInputException($"{quotesPath}: holds no quotes; a curve needs quotes.");
        }
        var date = valuationDate ?? BondFitInputs.SpotDate(DateOnly.FromDateTime(quotes.Min(q => q.QuoteTime).UtcDateTime));
        var asOf = quotes.Max(q => q.QuoteTime);
        var snapshot = new MarketSnapshot(quotesPath, date, asOf);
        var newest = new Dictionary<string, BondQuote>(StringComparer.Ordinal);
        foreach (var q in quotes)
        {
            if (!newest.TryGetValue(q.InstrumentId, out var seen) || q.QuoteTime >= seen.QuoteTime)
            {
                newest[q.InstrumentId] = q;
            }
        }
        foreach (var q in newest.Values)
        {
            if (!instruments.TryGetValue(q.InstrumentId, out var bond))
            {
                snapshot.Exclude(CurveKey.Government, new FitExclusion(q.InstrumentId, FitExclusionReason.Unknown, "not in the instruments file"));
                continue;
            }
            var key = CurveKey.Normalize(bond.SpreadGroup);
            var settlement = BondFitInputs.SettlementDate(bond, date);
            if (BondFitInputs.Exclusion(bond, q.QuoteTime, date, asOf, staleAfter) is { } exclusion)
            {
                snapshot.Exclude(key, exclusion);
                continue;
            }
            if (bond.MaturityDate <= settlement)
            {
                snapshot.Exclude(key, new FitExclusion(bond.Id, FitExclusionReason.Matured, Inv($"matures {bond.MaturityDate:yyyy-MM-dd}, on or before settlement {settlement:yyyy-MM-dd}")));
                continue;
            }
            try
            {
                snapshot.Usable(key).Add(BondFitInputs.Price(bond, q, settlement));
            }
            catch (ArgumentException ex)
            {
                snapshot.Exclude(key, new FitExclusion(bond.Id, FitExclusionReason.Invalid, ex.Message));
            }
        }
        return snapshot;
    }

    /// <summary>The government curve and a spread curve for each of <paramref name="spreadGroups"/>.</summary>
    public CurveSet Fit(CurveModel model, FitQualityGate baseGate, FitQualityGate spreadGate, IEnumerable<string> spreadGroups)
    {
        var government = FitGovernment(model, baseGate);
        var spreads = new Dictionary<string, FittedCurve>(StringComparer.Ordinal);
        foreach (var group in spreadGroups.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal))
        {
            spreads[group] = FitSpread(group, government.Result.Curve, spreadGate);
        }
        return new CurveSet(ValuationDate, government, spreads);
    }

    public FittedCurve FitGovernment(CurveModel model, FitQualityGate gate)
    {
        var quotes = Quotes(CurveKey.Government);
        var result = Refused("government curve", () =>
            new BondCurveFitter().Fit(Instruments(quotes), new CurveFitOptions { Model = model }, null, Excluded(CurveKey.Government)));
        return new FittedCurve(CurveKey.Government, result, gate, gate.Evaluate(result.Report), quotes);
    }

    /// <summary>
    /// The spread curve of <paramref name="group"/> over <paramref name="baseCurve"/> (Nelson-Siegel; a flat spread when
    /// the group has fewer usable quotes than the 4 parameters, see <see cref="FlatSpreadFit"/>).
    /// </summary>
    public FittedCurve FitSpread(string group, IZeroCurve baseCurve, FitQualityGate gate)
    {
        var quotes = Quotes(group);
        if (quotes.Count == 0)
        {
            throw new CliInputException(
                $"spread group '{group}': {QuotesPath} has no usable quote for it ({Excluded(group).Count} left out); its spread curve cannot be fitted.");
        }
        var instruments = Instruments(quotes);
        var result = instruments.Count < NelsonSiegelCurve.ParameterCount
            ? FlatSpreadFit.Fit(baseCurve, instruments, Excluded(group))
            : Refused($"spread group '{group}'", () =>
                new SpreadCurveFitter().Fit(baseCurve, instruments, new CurveFitOptions { Model = CurveModel.NelsonSiegel }, null, Excluded(group)));
        return new FittedCurve(group, result, gate, gate.Evaluate(result.Report), quotes);
    }

    private List<PricedBondQuote> Quotes(string key) =>
        [.. (_usable.TryGetValue(key, out var list) ? list : []).OrderBy(q => q.Bond.MaturityDate).ThenBy(q => q.Bond.Id, StringComparer.Ordinal)];

    private static List<FitInstrument> Instruments(List<PricedBondQuote> quotes) => [.. quotes.Select(q => q.ToFitInstrument())];

    private List<FitExclusion> Excluded(string key) =>
        [.. (_excluded.TryGetValue(key, out var list) ? list : []).OrderBy(e => e.Id, StringComparer.Ordinal)];

    private CurveFitResult Refused(string curve, Func<CurveFitResult> fit)
    {
        try
        {
            return fit();
        }
        catch (ArgumentException ex)
        {
            throw new CliInputException($"{curve} from {QuotesPath}: {ex.Message}", ex);
        }
    }

    private List<PricedBondQuote> Usable(string key)
    {
        if (!_usable.TryGetValue(key, out var list))
        {
            _usable[key] = list = [];
        }
        return list;
    }

    private void Exclude(string key, FitExclusion exclusion)
    {
        if (!_excluded.TryGetValue(key, out var list))
        {
            _excluded[key] = list = [];
        }
        list.Add(exclusion);
    }

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
