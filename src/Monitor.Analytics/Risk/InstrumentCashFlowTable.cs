using System.Globalization;
using System.Runtime.InteropServices;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Risk;

/// <summary>
/// The cash flows of every instrument the books may hold, per 100 face, each under its curve key, registered once.
/// Dates are numbered in a shared <see cref="CashFlowDateIndex"/>, so a <see cref="CurveGrid"/> built on it prices
/// every instrument (<see cref="InstrumentRiskRows"/>) and books then hold quantities of instruments
/// (<see cref="BookHoldings"/>) rather than merged cash flows.
/// </summary>
/// <remarks>
/// Why a second aggregation level: a book of 1,000 bonds with 20-60 flows each still has tens of thousands of
/// distinct (key, date) entries when coupon dates are spread over the calendar, and the date-merged pass is bound by
/// reading one grid row per entry. Exposures are linear in the flows (see <see cref="FactorExposures"/>), so
/// book = sum over holdings of quantity x instrument row, and an instrument row = sum over its flows of amount x grid row:
/// the grid is read once per instrument flow for all books together. Append-only; one writer, readers only while
/// nobody registers.
/// </remarks>
public sealed class InstrumentCashFlowTable
{
    private readonly List<int> _start = [0];
    private readonly List<int> _dateIndices = [];
    private readonly List<double> _amounts = [];
    private readonly List<string> _curveKeys = [];
    private Dictionary<string, bool[]>? _used;
    private int _usedCount = -1;

    /// <summary>A table whose dates are numbered in <paramref name="dates"/>.</summary>
    public InstrumentCashFlowTable(CashFlowDateIndex dates)
    {
        Dates = dates ?? throw new ArgumentNullException(nameof(dates));
    }

    /// <summary>The shared date index.</summary>
    public CashFlowDateIndex Dates { get; }

    /// <summary>Number of instruments registered.</summary>
    public int Count => _curveKeys.Count;

    /// <summary>Largest date index any flow uses (-1 when empty): a grid must cover it.</summary>
    public int MaxDateIndex { get; private set; } = -1;

    /// <summary>Total number of stored flows.</summary>
    public int FlowCount => _amounts.Count;

    /// <summary>
    /// Registers an instrument's flows (per 100 face; flows on one date are kept apart, which is harmless) under
    /// <paramref name="curveKey"/> (null or empty = government) and returns its instrument number (0, 1, 2, ...).
    /// </summary>
    public int Register(string? curveKey, IReadOnlyList<CashFlow> flowsPer100)
    {
        ArgumentNullException.ThrowIfNull(flowsPer100);
        for (var i = 0; i < flowsPer100.Count; i++)
        {
            if (!double.IsFinite(flowsPer100[i].Amount))
            {
                throw new ArgumentException(
                    string.Create(CultureInfo.InvariantCulture,
                        $"Cash flow {i} on {flowsPer100[i].Date:yyyy-MM-dd} has a non-finite amount {flowsPer100[i].Amount}."),
                    nameof(flowsPer100));
            }
        }
        foreach (var flow in flowsPer100)
        {
            var index = Dates.GetOrAdd(flow.Date);
            MaxDateIndex = Math.Max(MaxDateIndex, index);
            _dateIndices.Add(index);
            _amounts.Add(flow.Amount);
        }
        _start.Add(_amounts.Count);
        _curveKeys.Add(CurveKey.Normalize(curveKey));
        return _curveKeys.Count - 1;
    }

    /// <summary>Curve key of instrument <paramref name="instrument"/>.</summary>
    public string CurveKeyOf(int instrument) => _curveKeys[Check(instrument)];

    /// <summary>The registered flows of one instrument, per 100 face, in the order given.</summary>
    public IReadOnlyList<CashFlow> CashFlows(int instrument)
    {
        Check(instrument);
        var result = new CashFlow[_start[instrument + 1] - _start[instrument]];
        for (var j = 0; j < result.Length; j++)
        {
            var p = _start[instrument] + j;
            result[j] = new CashFlow(Dates[_dateIndices[p]], _amounts[p]);
        }
        return result;
    }

    // Zero-copy views for the risk pass (valid until the next Register).
    internal ReadOnlySpan<int> Starts => CollectionsMarshal.AsSpan(_start);

    internal ReadOnlySpan<int> DateIndices => CollectionsMarshal.AsSpan(_dateIndices);

    internal ReadOnlySpan<double> Amounts => CollectionsMarshal.AsSpan(_amounts);

    internal IReadOnlyList<string> CurveKeys => _curveKeys;

    // Per curve key, which date indices its instruments use (cached until the next Register); null if the key has none.
    internal bool[]? UsedDates(string curveKey)
    {
        if (_used is null || _usedCount != _curveKeys.Count)
        {
            var used = new Dictionary<string, bool[]>(StringComparer.Ordinal);
            for (var i = 0; i < _curveKeys.Count; i++)
            {
                if (!used.TryGetValue(_curveKeys[i], out var mask))
                {
                    mask = new bool[MaxDateIndex + 1];
                    used.Add(_curveKeys[i], mask);
                }
                for (var p = _start[i]; p < _start[i + 1]; p++)
                {
                    mask[_dateIndices[p]] = true;
                }
            }
            _used = used;
            _usedCount = _curveKeys.Count;
        }
        return _used.GetValueOrDefault(curveKey);
    }

    private int Check(int instrument) =>
        (uint)instrument < (uint)_curveKeys.Count
            ? instrument
            : throw new ArgumentOutOfRangeException(nameof(instrument), instrument,
                string.Create(CultureInfo.InvariantCulture, $"Instrument number must be in [0, {_curveKeys.Count})."));
}
