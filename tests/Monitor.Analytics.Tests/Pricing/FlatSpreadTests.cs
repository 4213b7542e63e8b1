using Monitor.Analytics.Curves;
using Monitor.Analytics.Pricing;

namespace Monitor.Analytics.Tests.Pricing;

/// <summary>
/// The flat (zero-volatility) spread: the one spread s with sum A_i exp(-(z(t_i) + s) t_i) = P
/// (Fabozzi, Fixed Income Analysis, 2nd ed., ch. 6). Checked by pricing on a known spread and solving it back.
/// </summary>
public sealed class FlatSpreadTests
{
    private static readonly NelsonSiegelCurve Base = new(0.035, -0.012, -0.006, 2.0);

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.0125)]
    [InlineData(-0.002)]
    [InlineData(0.35)]
    public void Solves_back_the_spread_a_price_was_made_with(double spread)
    {
        // A 5% semiannual 7-year bond, flows per 100 face (common practice, no source).
        var times = Enumerable.Range(1, 14).Select(i => i * 0.5 - 0.2).ToArray();
        var amounts = times.Select((_, i) => i == times.Length - 1 ? 102.5 : 2.5).ToArray();
        var price = times.Select((t, i) => amounts[i] * Math.Exp(-(Base.ZeroRate(t) + spread) * t)).Sum();

        var solved = FlatSpread.Solve(Base, times, amounts, price);

        Assert.Equal(spread, solved, 1e-10);
        var curve = new FlatSpreadCurve(solved);
        var repriced = times.Select((t, i) => amounts[i] * new SpreadedCurve(Base, curve).Discount(t)).Sum();
        Assert.Equal(price, repriced, 1e-9);
    }

    [Fact]
    public void A_price_no_spread_within_bounds_reaches_is_refused_with_the_price()
    {
        double[] times = [1.0, 2.0];
        double[] amounts = [5, 105];

        var error = Assert.Throws<ArgumentException>(() => FlatSpread.Solve(Base, times, amounts, 4000)); // needs about -185%;

        Assert.Contains("4000", error.Message, StringComparison.Ordinal);
    }
}
