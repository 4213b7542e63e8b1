using BenchmarkDotNet.Attributes;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Benchmarks;

/// <summary>
/// Warm refit of N government bonds (Nelson-Siegel) after quotes moved ~1 bp: ours (native LM, MathNet LM); QLNet
/// FittedBondDiscountCurve + NelsonSiegelFitting started from the previous solution is the subclass below (one refit
/// per iteration: it takes about a second). Each call alternates between two quote sets 1 bp apart.
/// </summary>
[MemoryDiagnoser]
public class WarmRefitBenchmarks
{
    private List<FitInstrument>[] _quotes = [];
    private double[][] _qlPrices = [];
    private List<QLNet.BondHelper> _helpers = [];
    private List<QLNet.SimpleQuote> _qlQuotes = [];
    private readonly BondCurveFitter _native = new();
    private readonly BondCurveFitter _mathNet = new();
    private double[] _nativeLast = [];
    private double[] _mathNetLast = [];
    private QLNet.FittedBondDiscountCurve? _qlCurve;
    private int _turn;

    [Params(100, 300, 1000)]
    public int Bonds { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var market = new SyntheticMarket(Bonds, 0);
        _quotes = [market.FitInstruments(SyntheticMarket.TrueBase), market.FitInstruments(SyntheticMarket.TrueBase, 1.0)];
        _qlPrices = [.. _quotes.Select(q => q.Select(i => i.DirtyPrice).ToArray())];
        QLNetMarket.SetToday();
        (_helpers, _qlQuotes) = QLNetMarket.Helpers(market.Bonds, _qlPrices[0]);
        _nativeLast = _native.Fit(_quotes[0], new CurveFitOptions()).Parameters;
        _mathNetLast = _mathNet.Fit(_quotes[0], new CurveFitOptions { Solver = FitSolver.MathNet }).Parameters;
        var t = SyntheticMarket.TrueBase;
        _qlCurve = QLNetMarket.Curve(_helpers, [t.Beta0, t.Beta1, t.Beta2, 1.0 / t.Tau]);
        _ = QLNetMarket.Solution(_qlCurve);
        Report(market);
    }

    [Benchmark(Baseline = true, Description = "ours, native LM")]
    public double OursNative()
    {
        var r = _native.Fit(_quotes[++_turn & 1], new CurveFitOptions(), _nativeLast);
        _nativeLast = r.Parameters;
        return r.Report.RmseBp;
    }

    [Benchmark(Description = "ours, MathNet LM")]
    public double OursMathNet()
    {
        var r = _mathNet.Fit(_quotes[++_turn & 1], new CurveFitOptions { Solver = FitSolver.MathNet }, _mathNetLast);
        _mathNetLast = r.Parameters;
        return r.Report.RmseBp;
    }

    internal double QLNetWarm()
    {
        var prices = _qlPrices[++_turn & 1];
        for (var i = 0; i < prices.Length; i++)
        {
            _qlQuotes[i].setValue(prices[i]);
        }
        return QLNetMarket.Solution(_qlCurve!)[0];
    }

    private void Report(SyntheticMarket market)
    {
        // Accuracy of one warm refit each on the moved quotes: largest zero-rate gap to the curve the quotes came from.
        var target = _quotes[1];
        var ours = _native.Fit(target, new CurveFitOptions(), _nativeLast).Curve;
        for (var i = 0; i < target.Count; i++)
        {
            _qlQuotes[i].setValue(target[i].DirtyPrice);
        }
        var ql = QLNetMarket.AsCurve(QLNetMarket.Solution(_qlCurve!));
        var truth = new Monitor.Analytics.Fitting.BondCurveFitter().Fit(target, new CurveFitOptions()).Curve;
        Console.WriteLine(FormattableString.Invariant(
            $"// ACCURACY warm {Bonds} bonds: max |z - z_fit| ours {Accuracy.MaxGapBp(ours, truth):F4} bp, QLNet {Accuracy.MaxGapBp(ql, truth):F4} bp (vs a cold fit of the same quotes); cash flows {market.Bonds.Sum(b => b.Times.Length)}"));
    }
}

/// <summary>QLNet warm refit (the baseline of the warm row), 100 and 300 bonds, one refit per iteration.</summary>
[MemoryDiagnoser]
[InvocationCount(1)]
public class QLNetWarmRefitBenchmarks
{
    private readonly WarmRefitBenchmarks _setup = new();

    [Params(100, 300)]
    public int Bonds { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _setup.Bonds = Bonds;
        _setup.Setup();
    }

    [Benchmark(Description = "QLNet warm (FittedBondDiscountCurve + NelsonSiegelFitting)")]
    public double QLNetWarm() => _setup.QLNetWarm();
}

/// <summary>Cold fit of 300 government bonds from no guess: ours (decay grid + LM) against QLNet with its default start.</summary>
[MemoryDiagnoser]
[InvocationCount(1)]
public class ColdFitBenchmarks
{
    private List<FitInstrument> _quotes = [];
    private List<QLNet.BondHelper> _helpers = [];

    [GlobalSetup]
    public void Setup()
    {
        var market = new SyntheticMarket(300, 0);
        _quotes = market.FitInstruments(SyntheticMarket.TrueBase);
        QLNetMarket.SetToday();
        (_helpers, _) = QLNetMarket.Helpers(market.Bonds, [.. _quotes.Select(q => q.DirtyPrice)]);
        var ours = new BondCurveFitter().Fit(_quotes, new CurveFitOptions()).Curve;
        var ql = QLNetMarket.AsCurve(QLNetMarket.Solution(QLNetMarket.Curve(_helpers, null)));
        Console.WriteLine(FormattableString.Invariant(
            $"// ACCURACY cold 300 bonds, no guess: max |z - z_true| over 0.25..30y ours {Accuracy.MaxGapBp(ours, SyntheticMarket.TrueBase):F4} bp, QLNet {Accuracy.MaxGapBp(ql, SyntheticMarket.TrueBase):F2} bp; QLNet x = {string.Join(", ", QLNetMarket.Solution(QLNetMarket.Curve(_helpers, null)))}"));
    }

    [Benchmark(Baseline = true, Description = "QLNet cold, default guess")]
    public double QLNetCold() => QLNetMarket.Solution(QLNetMarket.Curve(_helpers, null))[0];

    [Benchmark(Description = "ours cold, no guess (native LM)")]
    public double OursCold() => new BondCurveFitter().Fit(_quotes, new CurveFitOptions()).Parameters[0];
}

internal static class Accuracy
{
    public static double MaxGapBp(IZeroCurve a, IZeroCurve b)
    {
        var max = 0.0;
        for (var t = 0.25; t <= 30.0; t += 0.25)
        {
            max = Math.Max(max, Math.Abs(a.ZeroRate(t) - b.ZeroRate(t)) * 1e4);
        }
        return max;
    }
}
