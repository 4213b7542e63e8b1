using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>Bad input gives an error naming the field and the value (project rule, DEVELOPERS.md).</summary>
public class InputValidationTests
{
    private static FitInstrument Good(string id, double m) => new(id, [m / 2, m], [2.0, 102.0], 100.0, m);

    private static List<FitInstrument> Valid() => [.. Enumerable.Range(1, 10).Select(i => Good($"B{i}", i))];

    [Fact]
    public void NaN_price_names_the_instrument_and_field()
    {
        var list = Valid();
        list[3] = list[3] with { DirtyPrice = double.NaN };
        var ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(list, new CurveFitOptions()));
        Assert.Contains("instruments[3] (Id 'B4').DirtyPrice", ex.Message, StringComparison.Ordinal);
        Assert.Contains("NaN", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Empty_list_is_refused()
    {
        var ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit([], new CurveFitOptions()));
        Assert.Contains("instruments", ex.Message, StringComparison.Ordinal);
        Assert.Contains("empty", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Mismatched_cash_flow_arrays_are_refused()
    {
        var list = Valid();
        list[0] = list[0] with { Amounts = [102.0] };
        var ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(list, new CurveFitOptions()));
        Assert.Contains("instruments[0] (Id 'B1'): Times has 2 entries but Amounts has 1", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Non_positive_duration_and_non_finite_times_are_refused()
    {
        var list = Valid();
        list[1] = list[1] with { Duration = 0 };
        var ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(list, new CurveFitOptions()));
        Assert.Contains("(Id 'B2').Duration", ex.Message, StringComparison.Ordinal);

        list = Valid();
        list[2] = list[2] with { Times = [1.0, double.PositiveInfinity] };
        ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(list, new CurveFitOptions()));
        Assert.Contains("(Id 'B3').Times[1]", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Too_few_instruments_and_duplicate_ids_are_refused()
    {
        var ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(Valid().Take(3).ToList(), new CurveFitOptions()));
        Assert.Contains("at least 4 usable points, got 3", ex.Message, StringComparison.Ordinal);
        var dup = Valid();
        dup[5] = dup[5] with { Id = "B1" };
        ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(dup, new CurveFitOptions()));
        Assert.Contains("duplicate", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Warm_start_of_the_wrong_length_is_refused()
    {
        var ex = Assert.Throws<ArgumentException>(() => new BondCurveFitter().Fit(Valid(), new CurveFitOptions(), [0.04, -0.01, 0.0]));
        Assert.Equal("warmStart", ex.ParamName);
    }

    [Fact]
    public void Par_yield_points_in_percent_are_refused_and_blanks_noted()
    {
        double[] tenors = [0.25, 0.5, 1, 2, 5, 10, 30];
        var ex = Assert.Throws<ArgumentException>(() => new ParYieldCurveFitter().Fit(
            [.. tenors.Select(t => new ParYieldPoint(t, 4.5))], new CurveFitOptions()));
        Assert.Contains("points[0].ParYield (tenor 3M)", ex.Message, StringComparison.Ordinal);

        var withBlank = tenors.Select(t => new ParYieldPoint(t, 0.04 + 0.001 * t)).Append(new ParYieldPoint(20, double.NaN)).Append(new ParYieldPoint(7, null)).ToList();
        var fit = new ParYieldCurveFitter().Fit(withBlank, new CurveFitOptions());
        Assert.Contains("tenor 20Y has no par yield; skipped", fit.Report.Notes);
        Assert.Contains("tenor 7Y has no par yield; skipped", fit.Report.Notes);
    }

    [Fact]
    public void Bad_options_are_refused()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new BondCurveFitter().Fit(Valid(), new CurveFitOptions { MinTau = 5, MaxTau = 1 }));
        Assert.Contains("MinTau=5, MaxTau=1", ex.Message, StringComparison.Ordinal);
    }
}
