using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class LimitDefinitionTests
{
    private static LimitDefinition TwoSided() => new()
    {
        Id = "rates-dv01",
        Scope = LimitScope.Desk("rates"),
        Measure = ExposureMeasure.Dv01,
        Lower = -50_000,
        Upper = 100_000,
    };

    // Two-sided bounds: utilisation uses the bound on the exposure's own side
    // (domain primer, "Limits, as risk officers use them": two-sided bounds for signed measures).
    [Theory]
    [InlineData(80_000, 0.8)]
    [InlineData(-40_000, 0.8)] // short side: -40k / -50k
    [InlineData(-50_000, 1.0)]
    [InlineData(0, 0.0)]
    [InlineData(150_000, 1.5)]
    public void Utilisation_uses_the_bound_on_the_exposure_side(double exposure, double expected) =>
        Assert.Equal(expected, TwoSided().Utilisation(exposure), 12);

    [Fact]
    public void One_sided_upper_limit_ignores_short_exposure()
    {
        var limit = TwoSided() with { Lower = null };
        Assert.Equal(0.0, limit.Utilisation(-1e9));
        Assert.Null(limit.BoundFor(-1e9));
    }

    [Fact]
    public void Two_sided_limit_warns_on_either_side()
    {
        var limit = TwoSided();
        Assert.Equal(LimitStatus.Warning, LimitEvaluator.Evaluate(limit, LimitStatus.Within, 85_000)!.Current);
        Assert.Equal(LimitStatus.Breach, LimitEvaluator.Evaluate(limit, LimitStatus.Within, -55_000)!.Current);
        // Swinging from a long breach to a small short position clears.
        Assert.Equal(LimitStatus.Within, LimitEvaluator.Evaluate(limit, LimitStatus.Breach, -10_000)!.Current);
    }

    [Fact]
    public void Expiry_is_exclusive()
    {
        var at = new DateTimeOffset(2026, 12, 1, 17, 0, 0, TimeSpan.Zero);
        var limit = TwoSided() with { ExpiresAt = at };
        Assert.True(limit.IsActiveAt(at.AddTicks(-1)));
        Assert.False(limit.IsActiveAt(at));
    }

    [Fact]
    public void A_valid_definition_has_no_errors() => Assert.Empty(TwoSided().Validate());

    [Theory]
    [InlineData(1.2, 0.05, "WarningFraction", "1.2 is above 1")]
    [InlineData(0.0, 0.0, "WarningFraction", "0 is not above 0")]
    [InlineData(0.8, -0.01, "HysteresisFraction", "-0.01 is negative")]
    [InlineData(0.8, 0.8, "HysteresisFraction", "0.8 is not below the warning fraction 0.8")]
    public void Bad_fractions_are_named_with_their_value(double warning, double band, string field, string text)
    {
        var errors = (TwoSided() with { WarningFraction = warning, HysteresisFraction = band }).Validate();
        var error = Assert.Single(errors, e => e.Field == field);
        Assert.Contains(text, error.ToString(), StringComparison.Ordinal);
        Assert.Contains("rates-dv01", error.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Negative_upper_bound_is_rejected_with_the_fix()
    {
        var error = Assert.Single((TwoSided() with { Upper = -5, Lower = null }).Validate());
        Assert.Equal("Upper", error.Field);
        Assert.Equal("-5", error.Value);
        Assert.Contains("negative lower bound", error.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void Positive_lower_bound_is_rejected()
    {
        var errors = (TwoSided() with { Lower = 10 }).Validate();
        Assert.Contains(errors, e => e.Field == "Lower" && e.Value == "10");
    }

    [Fact]
    public void No_bound_at_all_is_rejected()
    {
        var error = Assert.Single((TwoSided() with { Lower = null, Upper = null }).Validate());
        Assert.Contains("bounds nothing", error.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Non_finite_bound_is_rejected()
    {
        Assert.Contains((TwoSided() with { Upper = double.PositiveInfinity }).Validate(), e => e.Field == "Upper" && e.Value == "Infinity");
    }

    [Fact]
    public void Empty_id_and_scope_are_rejected()
    {
        var errors = (TwoSided() with { Id = " ", Scope = LimitScope.Desk("") }).Validate();
        Assert.Contains(errors, e => e.Field == "Id");
        Assert.Contains(errors, e => e.Field == "Scope");
    }
}
