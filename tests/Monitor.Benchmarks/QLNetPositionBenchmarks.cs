using BenchmarkDotNet.Attributes;
using Monitor.Analytics.Curves;
using QL = QLNet;

namespace Monitor.Benchmarks;

/// <summary>
/// Per-position QLNet pricing on a sample of 10,000 of the 1,000,000 positions (scale by 100 for the full set):
/// each position's bond NPV (CashFlows.npv on a QLNet term structure of our curves) and 3 base + 3 spread factor
/// durations by one-sided 1 bp bump and reprice (7 NPVs per position). The plain loop on the same sample runs beside it.
/// </summary>
[MemoryDiagnoser]
public class QLNetPositionBenchmarks
{
    public const int Sample = 10_000;
    private RiskWorld _world = null!;
    private Position[] _sample = [];
    private QL.FixedRateBond[] _bonds = [];
    private double[] _plain = [];
    private int _turn;

    [GlobalSetup]
    public void Setup()
    {
        QLNetMarket.SetToday();
        _world = new RiskWorld(1_000, 1_000_000, withLedgers: false);
        _sample = _world.Positions[..Sample];
        _bonds = [.. _world.Market.Bonds.Select(QLNetMarket.Bond)];
        _plain = new double[1_000 * PlainPositionLoop.Width];
    }

    [Benchmark(Baseline = true, Description = "plain per-position loop, 10,000 positions")]
    public double PlainLoopSample()
    {
        PlainPositionLoop.Run(_world.Market, _sample, _world.BaseCurves[++_turn & 1], _world.Spreads, _plain);
        return _plain[0];
    }

    [Benchmark(Description = "QLNet per position (NPV + 6 bumped NPVs), 10,000 positions")]
    public double QLNetSample()
    {
        const double h = 1e-4;
        var b = (NelsonSiegelCurve)_world.BaseCurves[++_turn & 1];
        var baseCurves = new NelsonSiegelCurve[4];
        baseCurves[0] = b;
        for (var k = 0; k < 3; k++)
        {
            baseCurves[k + 1] = Bump(b, k, h);
        }
        // Term structures: [0] unbumped, [1..3] base factor bumps, [4..6] spread factor bumps; per curve key.
        var structures = new Dictionary<string, QL.YieldTermStructure[]>(StringComparer.Ordinal)
        {
            [""] = [.. baseCurves.Select(c => new FactorCurveTermStructure(c)), .. Enumerable.Repeat(new FactorCurveTermStructure(b), 3)],
        };
        foreach (var (group, spreadCurve) in _world.Spreads)
        {
            var s = (NelsonSiegelCurve)spreadCurve;
            structures[group] =
            [
                .. baseCurves.Select(c => new FactorCurveTermStructure(new SpreadedCurve(c, s))),
                .. Enumerable.Range(0, 3).Select(k => new FactorCurveTermStructure(new SpreadedCurve(b, Bump(s, k, h)))),
            ];
        }
        var today = QLNetMarket.Today;
        var books = new double[1_000 * 7];
        foreach (var p in _sample)
        {
            var flows = _bonds[p.Bond].cashflows();
            var ts = structures[_world.Market.Bonds[p.Bond].SpreadGroup ?? ""];
            var value = QL.CashFlows.npv(flows, ts[0], false, today, today);
            books[p.Book * 7] += p.Quantity * value;
            for (var k = 1; k < 7; k++)
            {
                var bumped = QL.CashFlows.npv(flows, ts[k], false, today, today);
                books[p.Book * 7 + k] += p.Quantity * -(bumped - value) / h;
            }
        }
        return books[0];
    }

    private static NelsonSiegelCurve Bump(NelsonSiegelCurve c, int k, double h) => k switch
    {
        0 => new(c.Beta0 + h, c.Beta1, c.Beta2, c.Tau),
        1 => new(c.Beta0, c.Beta1 + h, c.Beta2, c.Tau),
        _ => new(c.Beta0, c.Beta1, c.Beta2 + h, c.Tau),
    };
}
