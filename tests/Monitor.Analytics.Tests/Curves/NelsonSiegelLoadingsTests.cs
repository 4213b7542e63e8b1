using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Tests.Curves;

public class NelsonSiegelLoadingsTests
{
    [Fact]
    public void Curvature_loading_peaks_at_the_root_of_exp_x_equals_one_plus_x_plus_x_squared()
    {
        // Source: shared reference-data README ("derivation; no source needed beyond the formula"):
        // maximum at x = 1.7932821329, value 0.2984256.
        const double peak = 1.7932821329;
        Assert.Equal(0.2984256, NelsonSiegelLoadings.Curvature(peak), 7);
        Assert.True(NelsonSiegelLoadings.Curvature(peak) > NelsonSiegelLoadings.Curvature(peak - 1e-3));
        Assert.True(NelsonSiegelLoadings.Curvature(peak) > NelsonSiegelLoadings.Curvature(peak + 1e-3));
        Assert.Equal(0.0, NelsonSiegelLoadings.CurvatureDerivative(peak), 9);
    }

    [Fact]
    public void Diebold_Li_lambda_puts_the_curvature_peak_near_thirty_months()
    {
        // Source: Diebold and Li (2006), Journal of Econometrics 130: lambda = 0.0609 per month,
        // peak at 29.4 months (as quoted in the shared reference-data README).
        var peakMonths = 1.7932821329 / 0.0609;
        Assert.Equal(29.4, peakMonths, 1);
    }

    [Theory]
    [InlineData(5e-5)]
    [InlineData(2e-4)]
    [InlineData(0.3)]
    [InlineData(4.0)]
    public void Series_and_closed_forms_agree_across_the_switch(double x)
    {
        // Closed forms straight from the definitions (Nelson and Siegel 1987): S(x) = (1 - e^-x)/x.
        var closedSlope = (1 - Math.Exp(-x)) / x;
        var closedCurv = closedSlope - Math.Exp(-x);
        Assert.Equal(closedSlope, NelsonSiegelLoadings.Slope(x), 1e-9);
        Assert.Equal(closedCurv, NelsonSiegelLoadings.Curvature(x), 1e-9);
    }

    [Fact]
    public void Loadings_have_the_published_limits_at_zero_maturity()
    {
        // Nelson and Siegel (1987): slope loading -> 1 and curvature loading -> 0 as maturity -> 0.
        Assert.Equal(1.0, NelsonSiegelLoadings.Slope(1e-12), 12);
        Assert.Equal(0.0, NelsonSiegelLoadings.Curvature(1e-12), 12);
        var curve = new NelsonSiegelCurve(0.05, -0.02, 0.01, 2.0);
        Assert.Equal(0.03, curve.ZeroRate(1e-12), 12);
        Assert.Equal(0.03, curve.InstantaneousForward(0), 12);
    }
}
