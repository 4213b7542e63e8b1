using System.Globalization;
using BenchmarkDotNet.Attributes;
using Monitor.Service.Engine;

namespace Monitor.Benchmarks;

/// <summary>
/// The service's own revaluation path (<see cref="RiskEngine"/>), 1,000 books x 1,000 positions: after a government
/// refit (par-yield fit, the nine spread curves refitted on it, instrument rows rebuilt, every book revalued with
/// per-spread-group figures, limits evaluated); all books on unchanged curves; one trade (its book only).
/// </summary>
[MemoryDiagnoser]
public class EngineRevalueBenchmarks
{
    private EngineWorld _world = null!;
    private int _turn;
    private int _version = 1;
    private readonly List<double> _revalueMs = [];

    [GlobalSetup]
    public void Setup()
    {
        _world = new EngineWorld(1_000, 1_000_000);
        _world.Engine.ApplyTrade(Trade(_version, TradeAction.New, 1_000_000), EngineWorld.Now);
        Console.WriteLine(FormattableString.Invariant(
            $"// SHAPE engine: {_world.Engine.Books.Count} books, {_world.Engine.Books.Values.Sum(b => b.Positions.Count)} (book, bond) positions, {_world.Engine.Instruments.Count} instruments"));
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        if (_revalueMs.Count > 0)
        {
            // Over every call, warm-up and pilot included: the median and the minimum are the figures to read.
            _revalueMs.Sort();
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"// ENGINE revaluation inside a government refit (EngineResult.ExposureMilliseconds): median {_revalueMs[_revalueMs.Count / 2]:F2} ms, min {_revalueMs[0]:F2} ms over {_revalueMs.Count} refits"));
        }
    }

    [Benchmark(Description = "engine: government refit + spread refits + revalue 1,000 books + limits")]
    public int GovernmentRefit()
    {
        var result = _world.RefitGovernment(++_turn);
        _revalueMs.Add(result.ExposureMilliseconds);
        return result.Books.Count;
    }

    [Benchmark(Description = "engine: revalue 1,000 books on unchanged curves (rows reused) + limits")]
    public int RevalueAll() => _world.Engine.RevalueAll(EngineWorld.Now).Books.Count;

    [Benchmark(Description = "engine: one trade (amend), its book revalued")]
    public int OneTrade()
    {
        _version++;
        return _world.Engine.ApplyTrade(Trade(_version, TradeAction.Amend, (_version & 1) == 0 ? 2_000_000 : 1_000_000), EngineWorld.Now).Books.Count;
    }

    private TradeInput Trade(int version, TradeAction action, double face) =>
        new("BENCH-1", version, action, _world.BookIds[17], "GOV0042", face, 100, EngineWorld.Now);
}
