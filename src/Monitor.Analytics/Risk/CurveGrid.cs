using System.Globalization;
using System.Numerics;
using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Risk;

/// <summary>
/// One curve state evaluated once per distinct cash-flow date of all books (every date of a
/// <see cref="CashFlowDateIndex"/>), per curve key: the row of unit moments
/// [DF, t L_k DF, t^2 L_j L_k DF (j &lt;= k)] of <see cref="MomentLayout"/>, so that a book's exposures are
/// a weighted sum of rows (<see cref="BookRiskCalculator"/>). Dates on or before the valuation date get a
/// row of zeros (already paid: they drop out without a branch in the book loop).
/// </summary>
/// <remarks>
/// Memory: dates x keys x stride doubles, stride = 1 + n + n(n+1)/2 rounded up to the SIMD width
/// (n = 3: 10 -> 12; NS base + NS spread, n = 6: 28; Svensson + Svensson: 45 -> 48).
/// For example 10,000 dates, 10 keys, stride 28: 22 MB. Build cost: one set of loadings per date for the base curve, and one
/// exp plus the spread loadings per date and key; keys are filled in parallel. Immutable once built: safe to
/// read from many threads. The pure library uses <see cref="Parallel"/> here and in
/// <see cref="BookRiskCalculator"/>; it does no I/O.
/// </remarks>
public sealed class CurveGrid
{
    private readonly Dictionary<string, GridRows> _rows;

    private CurveGrid(DateOnly valuationDate, int dateCount, int baseFactorCount, Dictionary<string, GridRows> rows, RiskDepth depth)
    {
        Depth = depth;
        ValuationDate = valuationDate;
        DateCount = dateCount;
        BaseFactorCount = baseFactorCount;
        _rows = rows;
    }

    /// <summary>Date the curves are measured from.</summary>
    public DateOnly ValuationDate { get; }

    /// <summary>Number of dates of the index when the grid was built; ledgers must not use later dates.</summary>
    public int DateCount { get; }

    /// <summary>Number of base curve factors.</summary>
    public int BaseFactorCount { get; }

    /// <summary>
    /// <see cref="RiskDepth.Full"/> (from <see cref="Build(CashFlowDateIndex, DateOnly, IFactorCurve, IReadOnlyDictionary{string, IFactorCurve}?)"/>)
    /// or <see cref="RiskDepth.Durations"/>: rows of [DF, t L_k DF] only, for the batch passes; such a grid has no convexities
    /// and <see cref="BookRiskCalculator.Compute"/> refuses it.
    /// </summary>
    public RiskDepth Depth { get; }

    /// <summary>False for a grid from <see cref="BuildForInstruments"/>: only the pairs its instruments use are evaluated.</summary>
    public bool CoversAllDates { get; private init; } = true;

    /// <summary>Curve keys the grid can price: <see cref="CurveKey.Government"/> and each spread group.</summary>
    public IReadOnlyCollection<string> CurveKeys => _rows.Keys;

    /// <summary>
    /// Evaluates <paramref name="baseCurve"/> alone (key <see cref="CurveKey.Government"/>) and
    /// base + spread for each entry of <paramref name="spreadCurves"/> on all dates of <paramref name="dates"/>.
    /// </summary>
    public static CurveGrid Build(
        CashFlowDateIndex dates, DateOnly valuationDate, IFactorCurve baseCurve, IReadOnlyDictionary<string, IFactorCurve>? spreadCurves = null) =>
        Build(dates, valuationDate, baseCurve, spreadCurves, RiskDepth.Full);

    /// <summary>
    /// A grid for <see cref="InstrumentRiskRows"/> only: rows are evaluated just for the (curve key, date) pairs some
    /// instrument of <paramref name="instruments"/> uses (about 60% of all pairs for credit bonds paying on any day);
    /// other rows stay zero, so date-merged ledgers must not be priced on it (<see cref="CoversAllDates"/> is false and
    /// <see cref="BookRiskCalculator"/> refuses it).
    /// </summary>
    public static CurveGrid BuildForInstruments(
        InstrumentCashFlowTable instruments, DateOnly valuationDate, IFactorCurve baseCurve, IReadOnlyDictionary<string, IFactorCurve>? spreadCurves, RiskDepth depth)
    {
        ArgumentNullException.ThrowIfNull(instruments);
        return Build(instruments.Dates, valuationDate, baseCurve, spreadCurves, depth, instruments.UsedDates);
    }

    /// <summary>
    /// As the overload without <paramref name="depth"/>; <see cref="RiskDepth.Durations"/> writes only value and first
    /// moments (8 doubles a row for NS + NS spread instead of 28): less to write per curve change and to read per book.
    /// </summary>
    public static CurveGrid Build(
        CashFlowDateIndex dates, DateOnly valuationDate, IFactorCurve baseCurve, IReadOnlyDictionary<string, IFactorCurve>? spreadCurves, RiskDepth depth) =>
        Build(dates, valuationDate, baseCurve, spreadCurves, depth, null);

    private static CurveGrid Build(
        CashFlowDateIndex dates, DateOnly valuationDate, IFactorCurve baseCurve, IReadOnlyDictionary<string, IFactorCurve>? spreadCurves, RiskDepth depth,
        Func<string, bool[]?>? usedDates)
    {
        if (!Enum.IsDefined(depth))
        {
            throw new ArgumentOutOfRangeException(nameof(depth), depth, "Unknown risk depth.");
        }
        ArgumentNullException.ThrowIfNull(dates);
        ArgumentNullException.ThrowIfNull(baseCurve);
        var nb = PositionRisk.CheckedFactorCount(baseCurve, nameof(baseCurve));
        var count = dates.Count;
        var rows = new Dictionary<string, GridRows>(StringComparer.Ordinal)
        {
            [CurveKey.Government] = new GridRows(nb, 0, count, depth),
        };
        var spreads = new List<(GridRows Rows, IFactorCurve? Curve, bool[]? Used)>();
        foreach (var (key, curve) in spreadCurves ?? new Dictionary<string, IFactorCurve>())
        {
            if (CurveKey.IsGovernment(key))
            {
                throw new ArgumentException("A spread curve cannot use the government key (null or empty).", nameof(spreadCurves));
            }
            ArgumentNullException.ThrowIfNull(curve, $"{nameof(spreadCurves)}[{key}]");
            var ns = PositionRisk.CheckedFactorCount(curve, $"{nameof(spreadCurves)}[{key}]");
            var keyRows = new GridRows(nb, ns, count, depth);
            rows.Add(key, keyRows);
            spreads.Add((keyRows, curve, usedDates?.Invoke(key) ?? (usedDates is null ? null : [])));
        }

        // Base curve once per date, then each curve key (government and every spread group) on its own thread:
        // a spread row needs the base zero rate and loadings of its date.
        var times = new double[count];
        var baseZero = new double[count];
        var baseLoadings = new double[count * nb];
        for (var d = 0; d < count; d++)
        {
            var t = CurveTime.YearsBetween(valuationDate, dates[d]);
            times[d] = t;
            if (t > 0)
            {
                baseZero[d] = baseCurve.ZeroRate(t);
                baseCurve.Loadings(t, baseLoadings.AsSpan(d * nb, nb));
            }
        }
        var government = rows[CurveKey.Government];
        var governmentUsed = usedDates is null ? null : usedDates(CurveKey.Government) ?? []; // resolved before the threads start
        // One key alone (government only) runs on the calling thread: a parallel loop of one item still wakes pool
        // threads, which spin for work on a 2-core machine shared with the broker.
        if (spreads.Count == 0)
        {
            FillKey(0);
        }
        else
        {
            Parallel.For(0, spreads.Count + 1, FillKey);
        }
        return new CurveGrid(valuationDate, count, nb, rows, depth) { CoversAllDates = usedDates is null };

        void FillKey(int key)
        {
            Span<double> loadings = stackalloc double[PositionRisk.MaxFactors];
            var (keyRows, curve, used) = key == 0 ? (government, null, governmentUsed) : spreads[key - 1];
            var n = nb + keyRows.SpreadFactorCount;
            for (var d = 0; d < count; d++)
            {
                var t = times[d];
                if (t <= 0 || (used is not null && (d >= used.Length || !used[d])))
                {
                    continue; // rows stay zero: paid flows are worth nothing from here (or no instrument uses the pair)
                }
                baseLoadings.AsSpan(d * nb, nb).CopyTo(loadings);
                var z = baseZero[d];
                if (curve is not null)
                {
                    curve.Loadings(t, loadings[nb..n]);
                    z += curve is NelsonSiegelCurve ns
                        ? ns.Beta0 + ns.Beta1 * loadings[nb + 1] + ns.Beta2 * loadings[nb + 2] // = ZeroRate(t), same operations, two exponentials fewer
                        : curve.ZeroRate(t);
                }
                if (depth == RiskDepth.Full)
                {
                    MomentLayout.FillUnitRow(t, Math.Exp(-z * t), loadings[..n], keyRows.Row(d));
                }
                else
                {
                    MomentLayout.FillUnitFirstMoments(t, Math.Exp(-z * t), loadings[..n], keyRows.Row(d));
                }
            }
        }
    }

    internal GridRows RowsFor(string curveKey) =>
        _rows.TryGetValue(curveKey, out var rows)
            ? rows
            : throw new KeyNotFoundException(
                string.Create(CultureInfo.InvariantCulture, $"The curve grid has no curve for curve key '{curveKey}'; build it with that spread group's curve."));

    /// <summary>Unit-moment rows of one curve key, one row of <see cref="Stride"/> doubles per date index.</summary>
    internal sealed class GridRows
    {
        public GridRows(int baseFactorCount, int spreadFactorCount, int dateCount, RiskDepth depth)
        {
            BaseFactorCount = baseFactorCount;
            SpreadFactorCount = spreadFactorCount;
            Width = depth == RiskDepth.Full ? MomentLayout.Width(baseFactorCount + spreadFactorCount) : 1 + baseFactorCount + spreadFactorCount;
            var lanes = Vector<double>.Count;
            Stride = (Width + lanes - 1) / lanes * lanes;
            Data = new double[Math.Max(1, dateCount) * Stride];
        }

        public int BaseFactorCount { get; }

        public int SpreadFactorCount { get; }

        /// <summary>Doubles of the moment row that carry data.</summary>
        public int Width { get; }

        /// <summary>Doubles per date: <see cref="Width"/> padded with zeros to a multiple of the SIMD width.</summary>
        public int Stride { get; }

        public double[] Data { get; }

        public Span<double> Row(int dateIndex) => Data.AsSpan(dateIndex * Stride, Width);
    }
}
