using System.Globalization;
using BenchmarkDotNet.Attributes;
using Monitor.Service.Engine;

namespace Monitor.Benchmarks;

/// <summary>
/// The load's shape inside the engine (<see cref="SmallBooksWorld"/>: 1,000 books x 10 positions over 40 government
/// bonds, a limit per book, per desk of 50 and on the firm): a government refit from par yields (fit, rows rebuilt,
/// every book revalued, limits judged), and the same revaluation on unchanged curves (per-book overhead alone).
/// </summary>
[MemoryDiagnoser]
public class SmallBooksRefitBenchmarks
{
    private SmallBooksWorld _world = null!;
    private int _turn;
    private int _statusChanges;
    private readonly List<double> _revalueMs = [];

    [GlobalSetup]
    public void Setup()
    {
        _world = new SmallBooksWorld(1_000);
        Console.WriteLine(FormattableString.Invariant(
            $"// SHAPE small books: {_world.Engine.Books.Count} books, {_world.Engine.Books.Values.Sum(b => b.Positions.Count)} positions, {_world.Engine.Instruments.Count} instruments, {_world.Engine.Limits.Limits.Count} limits"));
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        if (_revalueMs.Count > 0)
        {
            _revalueMs.Sort();
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"// SMALLBOOKS revaluation inside a government refit (ExposureMilliseconds): median {_revalueMs[_revalueMs.Count / 2]:F3} ms, min {_revalueMs[0]:F3} ms over {_revalueMs.Count} refits; {_statusChanges} status changes"));
        }
    }

    [Benchmark(Description = "small books: government refit (par yields) + revalue 1,000 books + limits")]
    public int GovernmentRefit()
    {
        var result = _world.RefitGovernment(++_turn);
        _revalueMs.Add(result.ExposureMilliseconds);
        _statusChanges += result.StatusChanges.Count;
        return result.Books.Count;
    }

    [Benchmark(Description = "small books: revalue 1,000 books on unchanged curves + limits")]
    public int RevalueAll() => _world.Engine.RevalueAll(EngineWorld.Now).Books.Count;
}
