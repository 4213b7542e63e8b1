using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using Monitor.Limits;

namespace Monitor.Limits.Tests;

// The rule under test: step up at the threshold, step down only below threshold - band
// (domain primer, "Limits, as risk officers use them"). Warning at 80% use and a 5% band are
// common practice, no source.
public class LimitEvaluatorTests
{
    private const double Warning = 0.8;
    private const double Band = 0.05;

    [Theory]
    [InlineData(LimitStatus.Within, 0.79, LimitStatus.Within)]
    [InlineData(LimitStatus.Within, 0.80, LimitStatus.Warning)] // at the threshold counts as reached
    [InlineData(LimitStatus.Within, 0.99, LimitStatus.Warning)]
    [InlineData(LimitStatus.Within, 1.00, LimitStatus.Breach)]
    [InlineData(LimitStatus.Within, 3.00, LimitStatus.Breach)]
    [InlineData(LimitStatus.Warning, 0.76, LimitStatus.Warning)] // inside the band below 0.8: held
    [InlineData(LimitStatus.Warning, 0.75, LimitStatus.Warning)] // exactly threshold - band: not yet below
    [InlineData(LimitStatus.Warning, 0.7499, LimitStatus.Within)]
    [InlineData(LimitStatus.Breach, 0.96, LimitStatus.Breach)] // held down to 0.95
    [InlineData(LimitStatus.Breach, 0.9499, LimitStatus.Warning)]
    [InlineData(LimitStatus.Breach, 0.76, LimitStatus.Warning)] // below breach band, still within warning band
    [InlineData(LimitStatus.Breach, 0.10, LimitStatus.Within)] // a big move clears in one step
    [InlineData(LimitStatus.Warning, 1.00, LimitStatus.Breach)]
    public void Next_applies_thresholds_with_hysteresis(LimitStatus previous, double utilisation, LimitStatus expected) =>
        Assert.Equal(expected, LimitEvaluator.Next(previous, utilisation, Warning, Band));

    [Fact]
    public void Oscillating_noise_around_the_warning_level_changes_status_once()
    {
        var limit = Limit(upper: 1_000_000);
        var status = LimitStatus.Within;
        var changes = 0;
        // 0.78, 0.82, 0.78, 0.82, ...: swings of 4% of the limit, inside the 5% band.
        for (var i = 0; i < 200; i++)
        {
            var exposure = (i % 2 == 0 ? 0.78 : 0.82) * 1_000_000;
            var change = LimitEvaluator.Evaluate(limit, status, exposure);
            if (change is not null)
            {
                changes++;
                status = change.Current;
            }
        }

        Assert.Equal(1, changes);
        Assert.Equal(LimitStatus.Warning, status);
    }

    [Fact]
    public void Without_a_band_the_same_noise_flaps_which_is_why_the_band_exists()
    {
        var limit = Limit(upper: 1_000_000) with { HysteresisFraction = 0 };
        var status = LimitStatus.Within;
        var changes = 0;
        for (var i = 0; i < 10; i++)
        {
            var change = LimitEvaluator.Evaluate(limit, status, (i % 2 == 0 ? 0.82 : 0.78) * 1_000_000);
            if (change is not null)
            {
                changes++;
                status = change.Current;
            }
        }

        Assert.Equal(10, changes);
    }

    [Fact]
    public void Evaluate_reports_the_bound_on_the_exposure_side_and_utilisation()
    {
        var limit = Limit(upper: 200_000) with { Lower = -100_000 };
        var change = LimitEvaluator.Evaluate(limit, LimitStatus.Within, -90_000);
        Assert.NotNull(change);
        Assert.Equal(LimitStatus.Warning, change.Current);
        Assert.Equal(LimitStatus.Within, change.Previous);
        Assert.Equal(-100_000, change.LimitValue);
        Assert.Equal(0.9, change.Utilisation, 12);
        Assert.Equal("l1", change.LimitId);
        Assert.Equal(ExposureMeasure.Dv01, change.Measure);
    }

    [Fact]
    public void Unchanged_status_gives_no_change()
    {
        Assert.Null(LimitEvaluator.Evaluate(Limit(upper: 100), LimitStatus.Within, 10));
    }

    [Fact]
    public void Non_finite_exposure_is_rejected_with_its_value()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => LimitEvaluator.Evaluate(Limit(upper: 100), LimitStatus.Within, double.NaN));
        Assert.Contains("NaN", e.Message, StringComparison.Ordinal);
        Assert.Contains("l1", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Nan_utilisation_is_rejected_rather_than_read_as_within() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => LimitEvaluator.Next(LimitStatus.Breach, double.NaN, Warning, Band));

    // Property: utilisation wandering within +/- a of a threshold, with a below the band h, causes at
    // most one status change (the crossing on the way up), whatever the path. The thresholds are
    // chosen so the other threshold stays out of reach of the noise.
    [Property(MaxTest = 300)]
    public Property Noise_below_the_band_around_a_threshold_changes_status_at_most_once()
    {
        var scenario =
            from warningPct in Gen.Choose(50, 90)
            from bandPermille in Gen.Choose(5, 100)
            from amplitudeShare in Gen.Choose(1, 999) // amplitude = share/1000 of the band: strictly below it
            from atBreach in Gen.Elements(false, true)
            from steps in Gen.ListOf(Gen.Choose(-1000, 1000))
            select (Warning: warningPct / 100.0, Band: bandPermille / 1000.0, Amplitude: bandPermille / 1000.0 * amplitudeShare / 1000.0, AtBreach: atBreach, Steps: steps);

        return Prop.ForAll(Arb.From(scenario), s =>
        {
            var limit = Limit(upper: 5_000_000) with { WarningFraction = s.Warning, HysteresisFraction = s.Band };
            var threshold = s.AtBreach ? 1.0 : s.Warning;
            var status = s.AtBreach ? LimitStatus.Warning : LimitStatus.Within;
            var changes = 0;
            foreach (var step in s.Steps)
            {
                var utilisation = threshold + s.Amplitude * step / 1000.0;
                var change = LimitEvaluator.Evaluate(limit, status, utilisation * 5_000_000);
                if (change is not null)
                {
                    changes++;
                    status = change.Current;
                }
            }

            return changes <= 1;
        });
    }

    // Property: evaluating the same exposure twice never changes the status the second time.
    [Property(MaxTest = 300)]
    public bool Next_is_idempotent(byte previous, int utilisationPermille)
    {
        var p = (LimitStatus)(previous % 3);
        var u = Math.Abs(utilisationPermille % 1500) / 1000.0;
        var once = LimitEvaluator.Next(p, u, Warning, Band);
        return LimitEvaluator.Next(once, u, Warning, Band) == once;
    }

    internal static LimitDefinition Limit(double upper) => new()
    {
        Id = "l1",
        Scope = LimitScope.Book("b1"),
        Measure = ExposureMeasure.Dv01,
        Upper = upper,
        WarningFraction = Warning,
        HysteresisFraction = Band,
    };
}
