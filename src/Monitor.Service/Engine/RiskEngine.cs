using System.Collections.Concurrent;
using System.Diagnostics;
using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Analytics.Risk;
using Monitor.Limits;
using Monitor.Service.Messaging;

namespace Monitor.Service.Engine;

/// <summary>
/// The monitor's state and its rules, free of messaging and I/O: instruments, the latest quotes per curve,
/// the fitted curves, books (positions, held as quantities of instruments whose cash flows are registered once per
/// curve key) and limit statuses.
/// Every input either changes state and says what changed (an <see cref="EngineResult"/>), or throws a
/// <see cref="MessageRejectedException"/> before touching anything. Not thread-safe: one caller at a time.
/// All state is held by the instance (no static state), so books can later be split across instances.
/// The one exception to "one caller at a time" is <see cref="PriceQuote"/>, which reads only the instruments
/// (a concurrent map) and the settings, so quote consumers can check and price quotes while a refit runs.
/// </summary>
public sealed class RiskEngine
{
    // Concurrent so PriceQuote can read it from a consumer thread while the engine's owner writes it.
    private readonly ConcurrentDictionary<string, Bond> _instruments = new(StringComparer.Ordinal);
    private readonly Dictionary<string, RegisteredInstrument> _registered = new(StringComparer.Ordinal);
    private readonly Dictionary<string, CurveKeyInstruments> _byCurveKey = new(StringComparer.Ordinal);
    private readonly Dictionary<string, CurveState> _curves = new(StringComparer.Ordinal);
    private readonly Dictionary<string, BookState> _books = new(StringComparer.Ordinal);
    private readonly BondCurveFitter _baseFitter = new();
    private readonly ParYieldCurveFitter _parYieldFitter = new();
    private readonly Dictionary<string, SpreadCurveFitter> _spreadFitters = new(StringComparer.Ordinal);
    private readonly TradeRegister _trades = new();
    // Last published version per curve key before this start (LoggedCurveVersions): versions continue from there.
    private readonly Dictionary<string, int> _versionFloors = new(StringComparer.Ordinal);
    // The last traded clean price per instrument: the stand-in spread's price when a bond has no quote.
    private readonly Dictionary<string, (double CleanPrice, DateTimeOffset Time)> _lastTradePrices = new(StringComparer.Ordinal);

    /// <summary>Days either side of the valuation date a trade time may fall (common practice, no source: late bookings within a week).</summary>
    private const int TradeDayWindow = 7;

    /// <summary>How far ahead of the clock a par-yield set may be stamped (common practice, no source).</summary>
    private static readonly TimeSpan EventClockTolerance = TimeSpan.FromMinutes(5);
    private readonly LimitSet _limits;

    public RiskEngine(EngineSettings settings, LimitsConfiguration limits)
    {
        Settings = settings ?? throw new ArgumentNullException(nameof(settings));
        ArgumentNullException.ThrowIfNull(limits);
        _limits = limits.CreateLimitSet();
        _curves[CurveKey.Government] = new CurveState(CurveKey.Government);
        Reference = new CurveState(settings.ValuationCurveSource == ValuationCurveSource.BondQuotes ? CurveKeyLabel.GovernmentPar : CurveKeyLabel.GovernmentBonds);
        foreach (var book in limits.Hierarchy.Books)
        {
            _books[book] = new BookState(book, limits.Hierarchy.DeskOf(book));
        }
    }

    public EngineSettings Settings { get; }

    public DateOnly ValuationDate => Settings.ValuationDate;

    public IReadOnlyDictionary<string, Bond> Instruments => _instruments;

    public IReadOnlyDictionary<string, CurveState> Curves => _curves;

    /// <summary>
    /// The government curve fitted from the source that does not value the books (<see cref="EngineSettings.ValuationCurveSource"/>):
    /// published under its own id, never in <see cref="Curves"/> and never used for figures.
    /// </summary>
    public CurveState Reference { get; }

    public IReadOnlyDictionary<string, BookState> Books => _books;

    public LimitSet Limits => _limits;

    public TradeRegister Trades => _trades;

    /// <summary>
    /// Adds or replaces a bond's reference data and registers its cash flows once (again only when they or its curve
    /// key changed). A bond already held in a book may not change.
    /// </summary>
    public void DefineInstrument(Bond bond)
    {
        CheckDefinition(bond);
        var flows = bond.MaturityDate > ValuationDate ? bond.CashFlowsAfter(ValuationDate) : [];
        var key = CurveKey.Normalize(bond.SpreadGroup);
        if (!_registered.TryGetValue(bond.Id, out var registered) || !SameFlows(registered, key, flows))
        {
            // Tables are append-only: a redefined bond gets a new number; the old row stays, held by no book.
            if (!_byCurveKey.TryGetValue(key, out var instruments))
            {
                _byCurveKey[key] = instruments = new CurveKeyInstruments(key);
            }
            _registered[bond.Id] = new RegisteredInstrument(key, instruments.Table.Register(key, flows), flows.Count);
        }
        _instruments[bond.Id] = bond;
        if (!_curves.ContainsKey(key))
        {
            _curves[key] = new CurveState(key) { Version = _versionFloors.GetValueOrDefault(key) };
        }
    }

    /// <summary>
    /// Checks a definition without changing anything, so the caller can put it on record first: throws the refusal
    /// <see cref="DefineInstrument"/> would; returns the definition in use (null for an instrument new to the engine).
    /// </summary>
    public Bond? CheckDefinition(Bond bond)
    {
        ArgumentNullException.ThrowIfNull(bond);
        CheckCurrency(bond);
        if (_instruments.TryGetValue(bond.Id, out var existing) && !SameTerms(existing, bond) && IsHeld(bond.Id))
        {
            throw new MessageRejectedException("instrumentId", bond.Id, "is held in a book and its terms differ from the ones in use; amend reference data after the positions are closed.");
        }
        return existing;
    }

    /// <summary>
    /// Continues every curve's versions from <paramref name="lastVersions"/> (curve label -&gt; last published version,
    /// from durable state), so that versions only grow across restarts. Call before the first fit. Returns the engine.
    /// </summary>
    public RiskEngine ContinuingCurveVersions(IReadOnlyDictionary<string, int> lastVersions)
    {
        ArgumentNullException.ThrowIfNull(lastVersions);
        foreach (var (label, version) in lastVersions)
        {
            var key = CurveKeyLabel.KeyOf(label);
            if (key == Reference.Key && Reference.Current is null)
            {
                Reference.Version = Math.Max(Reference.Version, version);
            }
            _versionFloors[key] = Math.Max(version, _versionFloors.GetValueOrDefault(key));
            if (_curves.TryGetValue(key, out var curve) && curve.Current is null)
            {
                curve.Version = Math.Max(curve.Version, version);
            }
        }
        return this;
    }

    /// <summary>Keeps the quote as the newest for its bond and marks its curve for a refit. Returns the curve key.</summary>
    public string AcceptQuote(BondQuote quote, DateTimeOffset now) => StoreQuote(PriceQuote(quote, now));

    /// <summary>
    /// Checks a quote and prices it for the fitter without changing anything; safe to call from any thread while
    /// the engine's owner works. Throws <see cref="MessageRejectedException"/> naming the field for bad input.
    /// </summary>
    public PricedQuote PriceQuote(BondQuote quote, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(quote);
        var bond = RequireInstrument(quote.InstrumentId, "instrumentId");
        CheckCurrency(bond);
        // A quote from the future would outrank every real quote of its bond until the clock passed its stamp.
        CheckEventTime("quoteTime", quote.QuoteTime, now, Settings.QuoteClockTolerance);
        return Price(bond, quote);
    }

    /// <summary>Keeps a priced quote as the newest for its bond and marks its curve for a refit. Returns the curve key.</summary>
    public string StoreQuote(PricedQuote priced)
    {
        ArgumentNullException.ThrowIfNull(priced);
        var bond = RequireInstrument(priced.Bond.Id, "instrumentId");
        if (!ReferenceEquals(bond, priced.Bond))
        {
            priced = Price(bond, priced.Quote); // the bond was redefined after the quote was priced: price on today's terms
        }
        var key = CurveKey.Normalize(bond.SpreadGroup);
        var curve = CurveKey.IsGovernment(key) && Settings.ValuationCurveSource == ValuationCurveSource.ParYields ? Reference : _curves[key];
        if (curve.LatestQuotes.TryGetValue(bond.Id, out var previous) && previous.Quote.QuoteTime > priced.Quote.QuoteTime)
        {
            return curve.Key; // an older quote arriving late never replaces a newer one
        }
        curve.LatestQuotes[bond.Id] = priced;
        curve.Dirty = true;
        return curve.Key;
    }

    /// <summary>Curves with quotes waiting for a refit.</summary>
    public IReadOnlyList<string> DirtyCurves() => _curves.Values.Append(Reference).Where(c => c.Dirty).Select(c => c.Key).ToArray();

    /// <summary>
    /// Refits every curve with new quotes (the government curve first: spread curves sit on it, so a new
    /// government curve refits them all), then revalues the books that hold bonds on a changed curve and
    /// evaluates their limits.
    /// </summary>
    public EngineResult RefitDirtyCurves(DateTimeOffset now)
    {
        var result = new EngineResult();
        if (Reference.Dirty && FitGovernment(Reference, now) is { } referenceOutcome)
        {
            result.Curves.Add(referenceOutcome); // the reference curve: no figures move
        }
        var government = _curves[CurveKey.Government];
        var governmentChanged = false;
        if (government.Dirty && FitGovernment(government, now) is { } outcome)
        {
            result.Curves.Add(outcome);
            governmentChanged = outcome.Accepted;
        }
        RefitSpreadsAndRevalue(result, governmentChanged, now);
        return result;
    }

    /// <summary>
    /// Fits a government curve from par yields at tenors (decimals, bond-equivalent semiannual) through the same quality
    /// gate as a bond fit: the reference curve <c>government-par</c> (no figures move) unless par yields are the
    /// valuation source, when an accepted curve refits the spread curves on it and revalues every book.
    /// Only the government curve has par yields (<paramref name="curveId"/> "government").
    /// </summary>
    public EngineResult ApplyParYields(string curveId, DateTimeOffset asOf, IReadOnlyList<(string Tenor, double ParYield)> points, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(points);
        if (curveId != CurveKeyLabel.Government)
        {
            throw new MessageRejectedException("curveId", curveId, $"has no par-yield fit; only the '{CurveKeyLabel.Government}' curve is fitted from par yields.");
        }
        CheckEventTime("asOf", asOf, now, EventClockTolerance);
        if (points.Count == 0)
        {
            throw new MessageRejectedException("points", "[]", "is empty; give par yields at tenors such as 1Y, 2Y, 5Y, 10Y.");
        }
        var fitPoints = new List<Analytics.Fitting.ParYieldPoint>(points.Count);
        var seen = new HashSet<double>();
        for (var i = 0; i < points.Count; i++)
        {
            var (tenor, parYield) = points[i];
            if (!Tenor.TryParseYears(tenor, out var years) || !seen.Add(years))
            {
                throw new MessageRejectedException($"points[{i}].tenor", tenor, "is not a tenor such as 3M or 10Y, or appears twice.");
            }
            if (!double.IsFinite(parYield) || parYield < BondQuote.MinYield || parYield > BondQuote.MaxYield)
            {
                throw new MessageRejectedException($"points[{i}].parYield", parYield.ToString("G", CultureInfo.InvariantCulture),
                    $"is outside [{BondQuote.MinYield.ToString(CultureInfo.InvariantCulture)}, {BondQuote.MaxYield.ToString(CultureInfo.InvariantCulture)}] (decimals: 0.05 = 5%).");
            }
            fitPoints.Add(new Analytics.Fitting.ParYieldPoint(years, parYield));
        }
        var result = new EngineResult();
        if (Settings.ValuationCurveSource == ValuationCurveSource.BondQuotes)
        {
            // Par yields fit their own reference curve: fitted into the valuation curve too, it flipped between two fits.
            result.Curves.Add(Conclude(Reference, () => _parYieldFitter.Fit(fitPoints, Settings.BaseFit, Reference.Current?.Parameters), Settings.BaseGate, now, fitPoints.Count));
            return result;
        }
        var government = _curves[CurveKey.Government];
        var outcome = Conclude(government, () => _parYieldFitter.Fit(fitPoints, Settings.BaseFit, government.Current?.Parameters), Settings.BaseGate, now, fitPoints.Count);
        result.Curves.Add(outcome);
        RefitSpreadsAndRevalue(result, outcome.Accepted, now);
        return result;
    }

    private void RefitSpreadsAndRevalue(EngineResult result, bool governmentChanged, DateTimeOffset now)
    {
        var government = _curves[CurveKey.Government];
        if (government.Curve is null)
        {
            return;
        }
        var changed = new HashSet<string>(StringComparer.Ordinal);
        if (governmentChanged)
        {
            changed.Add(government.Key);
        }
        foreach (var curve in _curves.Values.Where(c => !CurveKey.IsGovernment(c.Key)).OrderBy(c => c.Key, StringComparer.Ordinal))
        {
            if ((curve.Dirty || (governmentChanged && curve.LatestQuotes.Count > 0)) && FitSpread(curve, government.Curve, now) is { } outcome)
            {
                result.Curves.Add(outcome);
                if (outcome.Accepted || curve.Curve is null)
                {
                    changed.Add(curve.Key); // still no curve: its books' stand-in spreads move with the new quotes
                }
            }
        }
        if (changed.Count > 0)
        {
            var affected = _books.Values.Where(b => governmentChanged || b.HoldsAny(changed.Contains));
            Revalue(affected, now, result);
        }
    }

    /// <summary>Loads a start-of-day position (no trade id, no limit events until the first revaluation).</summary>
    public void LoadPosition(string book, string instrumentId, double faceAmount)
    {
        var state = RequireBook(book, "book");
        var bond = RequireInstrument(instrumentId, "instrumentId");
        CheckFace(faceAmount);
        Move(state, bond, faceAmount);
    }

    /// <summary>
    /// What <see cref="ApplyTrade"/> would do with the trade, changing nothing: throws the same rejections, so the
    /// caller can make an applied trade durable (the exposure log) before the state changes.
    /// </summary>
    public TradeOutcome CheckTrade(TradeInput trade)
    {
        ArgumentNullException.ThrowIfNull(trade);
        RequireBook(trade.Book, "book");
        var bond = RequireInstrument(trade.InstrumentId, "instrumentId");
        CheckCurrency(bond);
        CheckFace(trade.FaceAmount);
        if (trade.Action != TradeAction.Cancel && bond.MaturityDate <= ValuationDate)
        {
            throw new MessageRejectedException("instrumentId", trade.InstrumentId, $"matured on {bond.MaturityDate:yyyy-MM-dd}; it cannot be traded.");
        }
        if (!double.IsFinite(trade.CleanPrice) || trade.CleanPrice <= 0 || trade.CleanPrice > BondQuote.MaxPrice)
        {
            throw new MessageRejectedException("cleanPrice", trade.CleanPrice.ToString("G", CultureInfo.InvariantCulture), $"is outside (0, {BondQuote.MaxPrice}] per 100 face.");
        }
        // A trade time weeks away from the valuation date is a clock or mapping error, not a trade of today's books.
        var tradeDay = DateOnly.FromDateTime(trade.TradeTime.UtcDateTime);
        if (tradeDay < ValuationDate.AddDays(-TradeDayWindow) || tradeDay > ValuationDate.AddDays(TradeDayWindow))
        {
            throw new MessageRejectedException("tradeTime", Iso(trade.TradeTime),
                $"is more than {TradeDayWindow} days from the valuation date {ValuationDate:yyyy-MM-dd}; check the source's clock.");
        }
        return _trades.Classify(trade).Outcome;
    }

    /// <summary>Applies a trade (new, amend or cancel by version) to its book and revalues that book only.</summary>
    public EngineResult ApplyTrade(TradeInput trade, DateTimeOffset now)
    {
        CheckTrade(trade);
        var book = _books[trade.Book];
        var bond = _instruments[trade.InstrumentId];
        var (outcome, previous) = _trades.Classify(trade);
        var result = new EngineResult { Trade = outcome };
        if (outcome != TradeOutcome.Applied)
        {
            return result;
        }
        var touched = new List<BookState>(2);
        if (previous is not null)
        {
            var oldBook = _books[previous.Book];
            Move(oldBook, _instruments[previous.InstrumentId], -previous.FaceAmount);
            touched.Add(oldBook);
        }
        if (trade.Action != TradeAction.Cancel)
        {
            Move(book, bond, trade.FaceAmount);
            if (!touched.Contains(book))
            {
                touched.Add(book);
            }
        }
        _trades.Record(trade);
        if (trade.Action != TradeAction.Cancel
            && (!_lastTradePrices.TryGetValue(trade.InstrumentId, out var last) || last.Time <= trade.TradeTime))
        {
            _lastTradePrices[trade.InstrumentId] = (trade.CleanPrice, trade.TradeTime);
        }
        if (_curves[CurveKey.Government].Curve is not null)
        {
            Revalue(touched, now, result);
        }
        return result;
    }

    /// <summary>Replaces the limits (a reload of the limits file). Books new to the hierarchy start empty.</summary>
    public LimitReloadResult ReloadLimits(LimitsConfiguration limits, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(limits);
        foreach (var book in _books.Values.Where(b => b.Positions.Count > 0 && !limits.Hierarchy.ContainsBook(b.Id)))
        {
            throw new LimitConfigurationException([$"desks: book '{book.Id}' holds positions and cannot be dropped from the hierarchy; keep it under a desk until its positions are closed."]);
        }
        var reload = _limits.Reload(limits.Hierarchy, limits.Limits, now);
        foreach (var book in limits.Hierarchy.Books.Where(b => !_books.ContainsKey(b)))
        {
            _books[book] = new BookState(book, limits.Hierarchy.DeskOf(book));
        }
        return reload;
    }

    /// <summary>
    /// Ends the temporary limits whose <c>expiresAt</c> the business clock (<paramref name="now"/>) has passed: each leaves
    /// the limit set with a change to <see cref="LimitStatus.Expired"/>. Empty when none expired.
    /// </summary>
    public IReadOnlyList<LimitStatusChange> ExpireLimits(DateTimeOffset now) =>
        _limits.RemoveExpired(now).Select(e => e.Change).ToArray();

    /// <summary>Revalues every book (start of day, end of day, after a reload).</summary>
    public EngineResult RevalueAll(DateTimeOffset now)
    {
        var result = new EngineResult();
        if (_curves[CurveKey.Government].Curve is not null)
        {
            Revalue(_books.Values, now, result);
        }
        return result;
    }

    /// <summary>"government v4, UTIL-A v2": the curves figures are computed on.</summary>
    public string CurvesInUse() =>
        string.Join(", ", _curves.Values.Where(c => c.Curve is not null).OrderBy(c => c.Key, StringComparer.Ordinal).Select(c => $"{c.Label} v{c.Version}"));

    /// <summary>Null when the curve has never been fitted and has fewer usable quotes than its gate's minimum: no fit is tried yet.</summary>
    private CurveFitOutcome? FitGovernment(CurveState curve, DateTimeOffset now)
    {
        var (instruments, excluded) = FitInputs(curve, now);
        if (TooFewForFirstFit(curve, instruments.Count, Settings.BaseGate))
        {
            return null;
        }
        return Conclude(curve, () => _baseFitter.Fit(instruments, Settings.BaseFit, curve.Current?.Parameters, excluded), Settings.BaseGate, now, instruments.Count + excluded.Count);
    }

    private CurveFitOutcome? FitSpread(CurveState curve, IZeroCurve baseCurve, DateTimeOffset now)
    {
        if (!_spreadFitters.TryGetValue(curve.Key, out var fitter))
        {
            _spreadFitters[curve.Key] = fitter = new SpreadCurveFitter();
        }
        var (instruments, excluded) = FitInputs(curve, now);
        if (TooFewForFirstFit(curve, instruments.Count, Settings.SpreadGate))
        {
            return null;
        }
        return Conclude(curve, () => fitter.Fit(baseCurve, instruments, Settings.SpreadFit, curve.Current?.Parameters, excluded), Settings.SpreadGate, now, instruments.Count + excluded.Count);
    }

    /// <summary>
    /// A curve without a fit waits, quietly, until it has the gate's minimum of usable quotes: a fit on fewer would only be
    /// refused (a CurveRejected event and a warning for the first quote of the day). A fitted curve that falls below the
    /// minimum is refitted and refused with the reason: that is news.
    /// </summary>
    private static bool TooFewForFirstFit(CurveState curve, int usable, FitQualityGate gate)
    {
        if (curve.Current is null && usable < gate.MinInstruments)
        {
            curve.Dirty = false; // the next quote marks it again
            return true;
        }
        return false;
    }

    /// <summary>
    /// Runs a fit and puts it through the gate. A fit the fitter refuses to run (too few usable points, say)
    /// is a rejection like any other: the last good curve stays, and the refit of the other curves goes on.
    /// </summary>
    private static CurveFitOutcome Conclude(CurveState curve, Func<CurveFitResult> fit, FitQualityGate gate, DateTimeOffset now, int offered)
    {
        curve.Dirty = false;
        CurveFitResult result;
        try
        {
            result = fit();
        }
        catch (ArgumentException ex)
        {
            curve.LastFitRejected = true;
            var refused = new FitQualityVerdict(false, ["no fit: " + ex.Message]);
            return new CurveFitOutcome(curve.Key, false, null, refused, KeptVersion(curve), curve.FittedAt, offered);
        }
        curve.LastReport = result.Report;
        var verdict = gate.Evaluate(result.Report);
        curve.LastFitRejected = !verdict.Passed;
        if (!verdict.Passed)
        {
            return new CurveFitOutcome(curve.Key, false, result, verdict, KeptVersion(curve), curve.FittedAt, offered);
        }
        curve.Current = result;
        curve.Version++;
        curve.FittedAt = now;
        return new CurveFitOutcome(curve.Key, true, result, verdict, curve.Version, null, offered);
    }

    /// <summary>The version of the curve a rejection keeps: 0 when none was fitted since the start (a continued version is not a curve).</summary>
    private static int KeptVersion(CurveState curve) => curve.Current is null ? 0 : curve.Version;

    private (List<FitInstrument> Instruments, List<FitExclusion> Excluded) FitInputs(CurveState curve, DateTimeOffset now)
    {
        var instruments = new List<FitInstrument>(curve.LatestQuotes.Count);
        var excluded = new List<FitExclusion>();
        foreach (var q in curve.LatestQuotes.Values.OrderBy(q => q.Bond.MaturityDate).ThenBy(q => q.Bond.Id, StringComparer.Ordinal))
        {
            if (BondFitInputs.Exclusion(q.Bond, q.Quote.QuoteTime, ValuationDate, now, Settings.StaleAfter) is { } exclusion)
            {
                excluded.Add(exclusion);
            }
            else
            {
                instruments.Add(new FitInstrument(q.Bond.Id, q.Times, q.Amounts, q.DirtyPrice, q.ModifiedDuration));
            }
        }
        return (instruments, excluded);
    }

    /// <summary>
    /// Revalues <paramref name="books"/> on the current curves: per curve key they hold, the instrument rows (built once
    /// per curve change, <see cref="CurveKeyInstruments"/>) times each book's quantities, all these books in one pass;
    /// a book's total is the sum of its keys' exposures, as for its cash flows merged by date. A book holding a spread
    /// group without a fitted curve is valued position by position with stand-in spreads and its figures are provisional
    /// (<see cref="ValueProvisionally"/>, <see cref="EngineResult.BooksAwaitingCurves"/>): never left out of its desk and firm.
    /// </summary>
    private void Revalue(IEnumerable<BookState> books, DateTimeOffset now, EngineResult result)
    {
        var clock = Stopwatch.StartNew();
        var government = _curves[CurveKey.Government].Curve!;
        var priced = new List<BookState>(books is ICollection<BookState> all ? all.Count : 0);
        List<BookState>? provisional = null;
        Func<string, bool> awaitsCurve = k => !CurveKey.IsGovernment(k) && _curves[k].Curve is null; // one delegate, not one per book
        foreach (var book in books)
        {
            if (book.HoldsAny(awaitsCurve))
            {
                result.BooksAwaitingCurves.Add(book.Id);
                (provisional ??= []).Add(book);
            }
            else
            {
                priced.Add(book);
            }
        }
        // Keys in ordinal order: each total is summed key by key in the order the per-key figures are listed.
        var passes = new List<(string Key, CurveKeyInstruments Instruments, IFactorCurve? Spread, List<int> Holders, List<BookHoldings> Holdings)>();
        foreach (var (key, instruments) in _byCurveKey.OrderBy(k => k.Key, StringComparer.Ordinal))
        {
            var holders = new List<int>(priced.Count);
            var holdings = new List<BookHoldings>(priced.Count);
            for (var i = 0; i < priced.Count; i++)
            {
                if (priced[i].HoldingsUnder(key) is { } held)
                {
                    holders.Add(i);
                    holdings.Add(held);
                }
            }
            if (holders.Count > 0)
            {
                passes.Add((key, instruments, CurveKey.IsGovernment(key) ? null : _curves[key].Curve, holders, holdings));
            }
        }
        // One key's grid is mostly serial work (its base curve date by date): build stale keys side by side.
        var rows = new InstrumentRiskRows[passes.Count];
        if (passes.Count == 1)
        {
            rows[0] = passes[0].Instruments.Rows(ValuationDate, government, passes[0].Spread);
        }
        else
        {
            Parallel.For(0, passes.Count, k => rows[k] = passes[k].Instruments.Rows(ValuationDate, government, passes[k].Spread));
        }
        var matrices = new BookRiskMatrix[passes.Count];
        // rowOf[i * passes + k]: book i's row in pass k's matrix, or -1 when it holds nothing under that key.
        var rowOf = new int[priced.Count * passes.Count];
        Array.Fill(rowOf, -1);
        for (var k = 0; k < passes.Count; k++)
        {
            var (_, instruments, _, holders, holdings) = passes[k];
            matrices[k] = instruments.ComputeBooks(holdings, rows[k]);
            for (var j = 0; j < holders.Count; j++)
            {
                rowOf[holders[j] * passes.Count + k] = j;
            }
        }
        var figures = new BookFiguresBuilder(government.FactorCount, passes.ConvertAll(p => p.Key), matrices, priced.Count);
        var limitUpdates = new (string BookId, BookExposures Exposures)[priced.Count + (provisional?.Count ?? 0)];
        result.Books.EnsureCapacity(result.Books.Count + limitUpdates.Length);
        for (var i = 0; i < priced.Count; i++)
        {
            var book = priced[i];
            var (moments, exposures) = figures.Build(rowOf.AsSpan(i * passes.Count, passes.Count));
            var update = new BookUpdate(book.Id, exposures, moments);
            book.SetFigures(update, now);
            result.Books.Add(update);
            limitUpdates[i] = (book.Id, exposures);
        }
        for (var i = 0; provisional is not null && i < provisional.Count; i++)
        {
            var update = ValueProvisionally(provisional[i], government);
            provisional[i].SetFigures(update, now);
            result.Books.Add(update);
            limitUpdates[priced.Count + i] = (update.Book, update.Exposures);
        }
        // All books first, then each desk and the firm once on the new figures (not once per book).
        result.StatusChanges.AddRange(_limits.UpdateBooks(limitUpdates, now));
        result.ExposureMilliseconds += clock.Elapsed.TotalMilliseconds;
        result.CurvesUsed = CurvesInUse();
    }

    /// <summary>
    /// A book holding a spread group without a fitted curve, valued position by position (<see cref="PositionRisk"/>):
    /// bonds of a fitted curve on it, the others on the government curve plus a flat spread from their own price
    /// (<see cref="StandInSpread"/>), one reason per such bond. Off the fast path: only while a curve is missing.
    /// </summary>
    private BookUpdate ValueProvisionally(BookState book, IFactorCurve government)
    {
        var byKey = new SortedDictionary<string, FactorExposures>(StringComparer.Ordinal);
        var reasons = new List<string>();
        foreach (var (id, face) in book.Positions.OrderBy(p => p.Key, StringComparer.Ordinal))
        {
            var registered = _registered[id];
            if (registered.FlowCount == 0)
            {
                continue; // matured: nothing left to value, as on the fast path
            }
            var key = registered.CurveKey;
            var spread = CurveKey.IsGovernment(key) ? null : _curves[key].Curve;
            if (!CurveKey.IsGovernment(key) && spread is null)
            {
                var bond = _instruments[id];
                (spread, var reason) = StandInSpread.For(bond, ValuationDate, government,
                    _curves[key].LatestQuotes.GetValueOrDefault(id), _lastTradePrices.TryGetValue(id, out var last) ? last : null);
                reasons.Add(reason);
            }
            var exposures = PositionRisk.Compute(_byCurveKey[key].Table.CashFlows(registered.Number), ValuationDate, government, spread, face / 100.0);
            byKey[key] = byKey.TryGetValue(key, out var sum) ? sum.Plus(exposures) : exposures;
        }
        var total = FactorExposures.Zero(government.FactorCount, 0);
        foreach (var exposures in byKey.Values)
        {
            total = total.Plus(exposures);
        }
        var risk = new BookRisk(total, new Dictionary<string, FactorExposures>(byKey, StringComparer.Ordinal));
        return new BookUpdate(book.Id, ExposureMapping.ToBookExposures(risk), risk) { ProvisionalReasons = reasons };
    }

    /// <summary>
    /// Why the figures a limit of <paramref name="scope"/> is judged on are provisional: the reasons of every book in the
    /// scope whose last figures are (prefixed with the book for a desk or the firm); empty when none is.
    /// </summary>
    public IReadOnlyList<string> ProvisionalReasons(LimitScope scope)
    {
        List<string>? reasons = null;
        foreach (var book in _books.Values.OrderBy(b => b.Id, StringComparer.Ordinal))
        {
            if (book.ProvisionalReasons.Count == 0
                || (scope.Level == LimitScopeLevel.Desk && book.Desk != scope.Id)
                || (scope.Level == LimitScopeLevel.Book && book.Id != scope.Id))
            {
                continue;
            }
            reasons ??= [];
            foreach (var reason in book.ProvisionalReasons)
            {
                reasons.Add(scope.Level == LimitScopeLevel.Book ? reason : $"book {book.Id}: {reason}");
            }
        }
        return reasons ?? (IReadOnlyList<string>)[];
    }

    /// <summary>How many times instrument rows were built, over all curve keys (tests check that a trade builds none).</summary>
    internal int InstrumentRowBuilds => _byCurveKey.Values.Sum(k => k.RowBuilds);

    private void Move(BookState book, Bond bond, double faceAmount)
    {
        var registered = _registered[bond.Id];
        var held = book.Positions.GetValueOrDefault(bond.Id) + faceAmount;
        if (Math.Abs(held) < 1e-6)
        {
            book.Positions.Remove(bond.Id);
            book.ClearHolding(registered.CurveKey, registered.Number);
        }
        else
        {
            book.Positions[bond.Id] = held;
            if (registered.FlowCount > 0)
            {
                book.AddHolding(registered.CurveKey, registered.Number, faceAmount / 100.0); // quantity = face / 100: flows are per 100 face
            }
        }
    }

    private PricedQuote Price(Bond bond, BondQuote quote)
    {
        var settlement = BondFitInputs.SettlementDate(bond, ValuationDate);
        if (bond.MaturityDate <= settlement)
        {
            throw new MessageRejectedException("instrumentId", bond.Id, $"matured on {bond.MaturityDate:yyyy-MM-dd}; quotes for it are not used.");
        }
        PricedBondQuote priced;
        try
        {
            priced = BondFitInputs.Price(bond, quote, settlement);
        }
        catch (ArgumentException ex)
        {
            throw new MessageRejectedException(quote.CleanMid is null ? "yield" : "midCleanPrice", (quote.CleanMid ?? quote.Yield)?.ToString("G", CultureInfo.InvariantCulture),
                RefusalText.Plain(ex, new Dictionary<string, string>(StringComparer.Ordinal)));
        }
        return new PricedQuote(quote, bond, settlement, priced.CleanPrice, priced.DirtyPrice, priced.Yield, priced.ModifiedDuration, priced.Times, priced.Amounts);
    }

    /// <summary>An event time more than <paramref name="ahead"/> ahead of the clock or more than 7 days behind it is refused.</summary>
    private static void CheckEventTime(string field, DateTimeOffset time, DateTimeOffset now, TimeSpan ahead)
    {
        if (time > now + ahead)
        {
            throw new MessageRejectedException(field, Iso(time),
                $"is in the future (now {Iso(now)}, {ahead.TotalSeconds.ToString(CultureInfo.InvariantCulture)} s allowed ahead); check the source's clock.");
        }
        if (time < now - TimeSpan.FromDays(7))
        {
            throw new MessageRejectedException(field, Iso(time), $"is more than 7 days old (now {Iso(now)}).");
        }
    }

    /// <summary>One reporting currency until several are supported: a bond in another would be priced on the wrong curve and summed into the wrong totals.</summary>
    private void CheckCurrency(Bond bond)
    {
        if (Settings.ReportingCurrency is { } reporting && !string.Equals(bond.Currency, reporting, StringComparison.Ordinal))
        {
            throw new MessageRejectedException("currency", bond.Currency,
                $"of instrument {bond.Id} is not the reporting currency {reporting} (Monitor:ReportingCurrency); bonds in other currencies are refused until several currencies are supported.");
        }
    }

    private Bond RequireInstrument(string id, string field) =>
        _instruments.TryGetValue(id, out var bond)
            ? bond
            : throw new MessageRejectedException(field, id, "is not a known instrument; define it first (InstrumentDefined or the instruments file).");

    private BookState RequireBook(string id, string field) =>
        _books.TryGetValue(id, out var book)
            ? book
            : throw new MessageRejectedException(field, id, "is not a book of the limits hierarchy; add it to the limits file.");

    private static void CheckFace(double face)
    {
        if (!double.IsFinite(face) || face == 0 || Math.Abs(face) > 1e12)
        {
            throw new MessageRejectedException("faceAmount", face.ToString("G", CultureInfo.InvariantCulture), "must be a non-zero amount no larger than 1e12 in size.");
        }
    }

    private bool IsHeld(string instrumentId) => _books.Values.Any(b => b.Positions.ContainsKey(instrumentId));

    private bool SameFlows(RegisteredInstrument registered, string curveKey, IReadOnlyList<CashFlow> flows) =>
        registered.CurveKey == curveKey && _byCurveKey[curveKey].Table.CashFlows(registered.Number).SequenceEqual(flows);

    private static bool SameTerms(Bond a, Bond b) =>
        a.CouponRate == b.CouponRate && a.Frequency == b.Frequency && a.DayCount == b.DayCount && a.IssueDate == b.IssueDate
        && a.FirstCouponDate == b.FirstCouponDate && a.MaturityDate == b.MaturityDate && a.Face == b.Face && a.SpreadGroup == b.SpreadGroup;

    private static string Iso(DateTimeOffset time) => time.ToString("O", CultureInfo.InvariantCulture);
}
