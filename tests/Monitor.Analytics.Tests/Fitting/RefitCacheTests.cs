using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>A fitter instance reuses its flattened cash flows between refits; the answer must not depend on that (no source needed).</summary>
public class RefitCacheTests
{
    private static readonly NelsonSiegelCurve Truth = new(0.045, -0.02, 0.015, 2.0);

    [Fact]
    public void Refit_with_new_prices_on_a_reused_fitter_equals_a_fresh_fit()
    {
        var bonds = SyntheticBonds.Generate(40, 12, Truth);
        bonds.Add(new FitInstrument("MATURED", [-0.2], [103.0], 100.0, 0.1));
        var stale = new FitExclusion(bonds[2].Id, FitExclusionReason.Stale, "old");
        var reused = new BondCurveFitter();
        var first = reused.Fit(bonds, new CurveFitOptions(), preExcluded: [stale]);

        var rng = new Random(3);
        var moved = bonds.Select(b => b.Id == "MATURED" ? b : SyntheticBonds.ShiftYield(b, 5 + rng.NextDouble())).ToList();
        var warm = reused.Fit(moved, new CurveFitOptions(), first.Parameters, [stale]);
        var fresh = new BondCurveFitter().Fit(moved, new CurveFitOptions(), first.Parameters, [stale]);

        Assert.Equal(fresh.Parameters, warm.Parameters);
        Assert.Equal(fresh.Report.Exclusions, warm.Report.Exclusions);
        Assert.Equal(fresh.Report.UsedIds, warm.Report.UsedIds);
        Assert.Contains(warm.Report.Exclusions, e => e.Id == "MATURED" && e.Reason == FitExclusionReason.Matured);
        // The curve moved up by about 5.5 bp.
        Assert.InRange((warm.Curve.ZeroRate(10) - first.Curve.ZeroRate(10)) * 1e4, 4.5, 6.5);
    }

    [Fact]
    public void A_bad_price_on_the_refit_path_is_still_refused_with_its_field()
    {
        var bonds = SyntheticBonds.Generate(20, 13, Truth);
        var fitter = new BondCurveFitter();
        fitter.Fit(bonds, new CurveFitOptions());
        bonds[4] = bonds[4] with { DirtyPrice = double.NaN };
        var ex = Assert.Throws<ArgumentException>(() => fitter.Fit(bonds, new CurveFitOptions()));
        Assert.Contains("instruments[4] (Id 'B004').DirtyPrice", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Spread_refit_follows_a_moved_base_curve()
    {
        var spread = new NelsonSiegelCurve(0.01, -0.003, 0.004, 1.5);
        var base1 = Truth;
        var base2 = new NelsonSiegelCurve(0.047, -0.02, 0.015, 2.0); // base up 20 bp
        var bonds = SyntheticBonds.Generate(25, 14, new SpreadedCurve(base2, spread));
        var fitter = new SpreadCurveFitter();
        var onOldBase = fitter.Fit(base1, bonds, new CurveFitOptions());
        var onNewBase = fitter.Fit(base2, bonds, new CurveFitOptions(), onOldBase.Parameters);
        // Same prices: on the old base the fitted spread absorbs the 20 bp; on the new base it is the true spread.
        Assert.InRange((onOldBase.Curve.ZeroRate(5) - spread.ZeroRate(5)) * 1e4, 19, 21);
        Assert.InRange((onNewBase.Curve.ZeroRate(5) - spread.ZeroRate(5)) * 1e4, -0.01, 0.01);
    }
}
