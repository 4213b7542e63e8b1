using BenchmarkDotNet.Attributes;
using Monitor.Analytics.Risk;

namespace Monitor.Benchmarks;

/// <summary>
/// Revalue all books after a curve change: value, DV01, 3 base + 3 spread factor durations per book.
/// "ours" rebuilds everything a curve change needs (grid on all cash-flow dates, instrument rows, the book pass).
/// Baseline: the plain per-position loop. Positions over 1,000 books (10, 100, 1,000 per book).
/// </summary>
[MemoryDiagnoser]
public class RevalueBenchmarks
{
    private RiskWorld _world = null!;
    private BookRiskMatrix? _matrix;
    private BookRiskMatrix? _ledgerMatrix;
    private InstrumentRiskRows? _rows;
    private double[] _plain = [];
    private int _turn;

    [Params(10_000, 100_000, 1_000_000)]
    public int Positions { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _world = new RiskWorld(1_000, Positions, withLedgers: true);
        _plain = new double[1_000 * PlainPositionLoop.Width];
        _rows = InstrumentRiskRows.Build(_world.Table, _world.InstrumentGrid(0), RiskDepth.Durations);
        _ = BookRiskCalculator.ComputeAll(_world.Ledgers, _world.Grid(0, RiskDepth.Durations), RiskDepth.Durations);
        var entries = _world.Ledgers.Sum(l => l.EntryCount);
        var holdings = _world.Holdings.Sum(h => h.Count);
        Console.WriteLine(FormattableString.Invariant(
            $"// SHAPE {Positions} positions: {_world.Dates.Count} distinct dates, {_world.Table.FlowCount} instrument flows, {holdings} holdings, {entries} ledger (key, date) entries"));
    }

    [Benchmark(Baseline = true, Description = "plain per-position loop (1 core)")]
    public double PlainLoop()
    {
        PlainPositionLoop.Run(_world.Market, _world.Positions, _world.BaseCurves[++_turn & 1], _world.Spreads, _plain);
        return _plain[0];
    }

    [Benchmark(Description = "ours: grid + instrument rows + holdings, 2 cores")]
    public double OursHoldings() => Holdings(2);

    [Benchmark(Description = "ours: grid + instrument rows + holdings, 1 core")]
    public double OursHoldingsOneCore() => Holdings(1);

    [Benchmark(Description = "ours: book pass only (rows ready), 2 cores")]
    public double OursBookPassOnly()
    {
        _matrix = HoldingsRiskCalculator.ComputeAll(_world.Holdings, _rows!, _matrix, 2);
        return _matrix.Value(0);
    }

    [Benchmark(Description = "ours: grid + date-merged ledgers, 2 cores")]
    public double OursLedgers()
    {
        var grid = _world.Grid(++_turn, RiskDepth.Durations);
        _ledgerMatrix = BookRiskCalculator.ComputeAll(_world.Ledgers, grid, RiskDepth.Durations, _ledgerMatrix, 2);
        return _ledgerMatrix.Value(0);
    }

    [Benchmark(Description = "first design: full grid + ledgers, per-key BookRisk objects, 2 cores")]
    public double FirstDesign()
    {
        var grid = _world.Grid(++_turn, RiskDepth.Full);
        return BookRiskCalculator.ComputeAll(_world.Ledgers, grid, 2)[0].Total.Value;
    }

    private double Holdings(int cores)
    {
        var grid = _world.InstrumentGrid(++_turn);
        var rows = InstrumentRiskRows.Build(_world.Table, grid, RiskDepth.Durations, cores);
        _matrix = HoldingsRiskCalculator.ComputeAll(_world.Holdings, rows, _matrix, cores);
        return _matrix.Value(0);
    }
}

/// <summary>How cost grows with the number of books: 1,000,000 positions in 10, 100 or 1,000 books.</summary>
[MemoryDiagnoser]
public class BookScalingBenchmarks
{
    private RiskWorld _world = null!;
    private BookRiskMatrix? _matrix;
    private int _turn;

    [Params(10, 100, 1_000)]
    public int Books { get; set; }

    [GlobalSetup]
    public void Setup() => _world = new RiskWorld(Books, 1_000_000, withLedgers: true);

    [Benchmark(Baseline = true, Description = "ours: grid + date-merged ledgers, 2 cores")]
    public double OursLedgers()
    {
        var grid = _world.Grid(++_turn, RiskDepth.Durations);
        _matrix = BookRiskCalculator.ComputeAll(_world.Ledgers, grid, RiskDepth.Durations, _matrix, 2);
        return _matrix.Value(0);
    }

    [Benchmark(Description = "ours: grid + instrument rows + holdings, 2 cores")]
    public double OursHoldings()
    {
        var grid = _world.InstrumentGrid(++_turn);
        var rows = InstrumentRiskRows.Build(_world.Table, grid, RiskDepth.Durations, 2);
        _matrix = HoldingsRiskCalculator.ComputeAll(_world.Holdings, rows, _matrix, 2);
        return _matrix.Value(0);
    }
}

/// <summary>How the curve-change cost grows with the bond universe (100, 300, 1,000 government bonds; 1,000 books x 100 positions).</summary>
[MemoryDiagnoser]
public class UniverseScalingBenchmarks
{
    private SyntheticMarket _market = null!;
    private CashFlowDateIndex _dates = null!;
    private InstrumentCashFlowTable _table = null!;
    private List<BookHoldings> _books = [];
    private BookRiskMatrix? _matrix;
    private int _turn;

    [Params(100, 300, 1_000)]
    public int Bonds { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _market = new SyntheticMarket(Bonds, 0);
        _dates = new CashFlowDateIndex();
        _table = new InstrumentCashFlowTable(_dates);
        foreach (var b in _market.Bonds)
        {
            _table.Register(b.SpreadGroup, b.Flows);
        }
        _books = [.. Enumerable.Range(0, 1_000).Select(_ => new BookHoldings())];
        foreach (var p in SyntheticMarket.Positions(Bonds, 1_000, 100_000))
        {
            _books[p.Book].Add(p.Bond, p.Quantity);
        }
    }

    [Benchmark(Description = "ours: grid + instrument rows + holdings, 2 cores")]
    public double OursHoldings()
    {
        var curve = new Monitor.Analytics.Curves.NelsonSiegelCurve(0.04 + (++_turn & 1) * 1e-4, -0.01, 0.01, 2.0);
        var grid = CurveGrid.BuildForInstruments(_table, SyntheticMarket.ValuationDate, curve, null, RiskDepth.Durations);
        var rows = InstrumentRiskRows.Build(_table, grid, RiskDepth.Durations, 2);
        _matrix = HoldingsRiskCalculator.ComputeAll(_books, rows, _matrix, 2);
        return _matrix.Value(0);
    }
}
