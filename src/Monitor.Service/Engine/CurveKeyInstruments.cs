using Monitor.Analytics.Curves;
using Monitor.Analytics.Risk;

namespace Monitor.Service.Engine;

/// <summary>
/// The instruments discounted under one curve key: their cash flows per 100 face, registered once, and their risk
/// rows on the current curves. Rows are rebuilt only when the base curve or this key's spread curve is a new fit, or
/// an instrument was registered since; a trade reuses them.
/// </summary>
/// <remarks>
/// One table per key, each with its own date index: the grid of a key then covers only that key's dates, a spread
/// refit rebuilds only its key, and instruments of a key without a fitted curve are never priced. Exposures per key
/// come out of the book pass directly (each book holds its instruments per key), as the limits of one spread group
/// need them.
/// </remarks>
internal sealed class CurveKeyInstruments
{
    /// <summary>Passes of fewer books than this (a trade's) neither use nor replace the kept matrix.</summary>
    private const int KeptMatrixMinBooks = 16;

    private InstrumentRiskRows? _rows;
    private BookRiskMatrix? _matrix;
    private IFactorCurve? _rowsBase;
    private IFactorCurve? _rowsSpread;

    public CurveKeyInstruments(string curveKey)
    {
        CurveKey = curveKey;
        Table = new InstrumentCashFlowTable(new CashFlowDateIndex());
    }

    public string CurveKey { get; }

    public InstrumentCashFlowTable Table { get; }

    /// <summary>How many times the rows were built (tests check that a trade builds none).</summary>
    public int RowBuilds { get; private set; }

    /// <summary>
    /// Rows of every registered instrument on <paramref name="baseCurve"/> (plus <paramref name="spreadCurve"/> for a
    /// spread group), built now unless the last rows were built on the same curve objects (fits are immutable, so the
    /// same object means the same curve) and the same instruments.
    /// </summary>
    public InstrumentRiskRows Rows(DateOnly valuationDate, IFactorCurve baseCurve, IFactorCurve? spreadCurve)
    {
        if (_rows is not null && _rows.Count == Table.Count
            && ReferenceEquals(_rowsBase, baseCurve) && ReferenceEquals(_rowsSpread, spreadCurve))
        {
            return _rows;
        }
        var spreads = spreadCurve is null ? null : new Dictionary<string, IFactorCurve>(StringComparer.Ordinal) { [CurveKey] = spreadCurve };
        // Full depth: the limits' convexity measure needs the base level second moment.
        var grid = CurveGrid.BuildForInstruments(Table, valuationDate, baseCurve, spreads, RiskDepth.Full);
        _rows = InstrumentRiskRows.Build(Table, grid, RiskDepth.Full);
        _rowsBase = baseCurve;
        _rowsSpread = spreadCurve;
        RowBuilds++;
        return _rows;
    }

    /// <summary>
    /// Each book's moments on <paramref name="rows"/>. A pass over many books overwrites the matrix of the last such pass
    /// when the book count is the same (a refit revalues the same books each time): a thousand books' matrix is past the
    /// large-object threshold, and a new one per refit would be collected only by full collections. Callers copy what
    /// they keep out of the matrix before the next pass.
    /// </summary>
    public BookRiskMatrix ComputeBooks(IReadOnlyList<BookHoldings> holdings, InstrumentRiskRows rows)
    {
        if (holdings.Count < KeptMatrixMinBooks)
        {
            return HoldingsRiskCalculator.ComputeAll(holdings, rows);
        }
        return _matrix = HoldingsRiskCalculator.ComputeAll(holdings, rows, _matrix);
    }
}
