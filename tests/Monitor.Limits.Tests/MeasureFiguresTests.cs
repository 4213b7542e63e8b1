using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class MeasureFiguresTests
{
    [Fact]
    public void Holds_one_value_per_measure_and_reads_like_a_dictionary()
    {
        var figures = new MeasureFigures(m => (int)m * 10.0);

        Assert.Equal(Enum.GetValues<ExposureMeasure>().Length, figures.Count);
        Assert.All(Enum.GetValues<ExposureMeasure>(), m => Assert.Equal((int)m * 10.0, figures[m]));
        Assert.Equal(figures.Keys, figures.Select(p => p.Key));
        Assert.False(figures.TryGetValue((ExposureMeasure)99, out _));
        Assert.Throws<KeyNotFoundException>(() => figures[(ExposureMeasure)99]);
    }

    [Fact]
    public void Built_from_a_span_it_holds_the_values_in_enum_order_and_refuses_a_wrong_length()
    {
        double[] values = [.. Enumerable.Range(0, MeasureFigures.MeasureCount).Select(i => i * 1.5 - 3)];

        var figures = new MeasureFigures(values);
        values[0] = 99; // copied: a later change of the caller's array must not reach the figures

        Assert.Equal(Enum.GetValues<ExposureMeasure>().Length, MeasureFigures.MeasureCount);
        Assert.Equal(-3.0, figures[ExposureMeasure.MarketValue]);
        Assert.Equal(values.Skip(1), figures.Values.Skip(1));
        Assert.Equal(figures.Values, figures.Select(p => p.Value));
        Assert.Throws<ArgumentException>(() => new MeasureFigures(values.AsSpan(1)));
    }

    [Fact]
    public void A_limit_set_reads_a_book_from_immutable_figures_and_from_a_dictionary_the_caller_changes_later_alike()
    {
        var hierarchy = BookHierarchyTests.Sample();
        var set = new LimitSet(hierarchy, []);
        var mutable = new Dictionary<ExposureMeasure, double> { [ExposureMeasure.Dv01] = 7 };
        set.UpdateBooks([("govt-short", BookExposures.FromTotals(new MeasureFigures(m => m == ExposureMeasure.Dv01 ? 5 : 0))), ("govt-long", BookExposures.FromTotals(mutable))], DateTimeOffset.UnixEpoch);
        mutable[ExposureMeasure.Dv01] = 1_000; // copied on the way in: this must not reach the set

        Assert.Equal(12, set.ExposureOf(LimitScope.Desk("rates"), ExposureMeasure.Dv01));
    }
}
