using BenchmarkDotNet.Attributes;

namespace Monitor.Benchmarks;

/// <summary>
/// Apply one trade to its book, amortised over 1,000 trades in random bonds of random books (1,000 books x 1,000
/// positions). Calls alternate between buying and selling the same trades, so the books stay the same size.
/// "+ compaction" includes rebuilding the sorted view the next risk pass reads (the ledger re-sorts a key's dates
/// when a trade brings a date the book did not have).
/// </summary>
[MemoryDiagnoser]
public class TradeBenchmarks
{
    private const int Trades = 1_000;
    private RiskWorld _world = null!;
    private Position[] _trades = [];
    private double _sign = 1.0;

    [GlobalSetup]
    public void Setup()
    {
        _world = new RiskWorld(1_000, 1_000_000, withLedgers: true);
        _trades = SyntheticMarket.Positions(_world.Market.Bonds.Count, 1_000, Trades, seed: 99);
        var rng = new Random(5);
        _trades = [.. _trades.Select(t => t with { Book = rng.Next(1_000) })];
        var flows = _trades.Select(t => _world.Market.Bonds[t.Bond].Flows.Length).ToArray();
        Console.WriteLine(FormattableString.Invariant($"// TRADES flows per traded bond: min {flows.Min()}, mean {flows.Average():F1}, max {flows.Max()}"));
    }

    [Benchmark(Baseline = true, OperationsPerInvoke = Trades, Description = "ledger Add (flows merged by date)")]
    public void LedgerAdd()
    {
        _sign = -_sign;
        foreach (var t in _trades)
        {
            var bond = _world.Market.Bonds[t.Bond];
            _world.Ledgers[t.Book].Add(bond.SpreadGroup, bond.Flows, _sign * t.Quantity);
        }
    }

    [Benchmark(OperationsPerInvoke = Trades, Description = "ledger Add + compaction")]
    public void LedgerAddAndCompact()
    {
        _sign = -_sign;
        foreach (var t in _trades)
        {
            var bond = _world.Market.Bonds[t.Bond];
            _world.Ledgers[t.Book].Add(bond.SpreadGroup, bond.Flows, _sign * t.Quantity);
            _ = _world.Ledgers[t.Book].GetSegment(bond.SpreadGroup);
        }
    }

    [Benchmark(OperationsPerInvoke = Trades, Description = "holdings Add (always compact)")]
    public void HoldingsAdd()
    {
        _sign = -_sign;
        foreach (var t in _trades)
        {
            _world.Holdings[t.Book].Add(t.Bond, _sign * t.Quantity);
        }
    }
}
