using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class LimitSetSpreadGroupTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 1, 10, 0, 0, TimeSpan.Zero);

    // A spread-group limit sums only that group's figures across the scope's books; totals and
    // other groups do not count (domain primer, "Limits, as risk officers use them": scope optionally
    // narrowed to a spread group).
    [Fact]
    public void Spread_group_limit_counts_only_that_group()
    {
        var limit = new LimitDefinition
        {
            Id = "credit-bbb-level",
            Scope = LimitScope.Desk("credit"),
            SpreadGroup = "corp-bbb",
            Measure = ExposureMeasure.SpreadLevel,
            Upper = 100,
        };
        var set = new LimitSet(BookHierarchyTests.Sample(), [limit]);
        static BookExposures Figures(double total, double bbb, double a) => new()
        {
            Totals = new Dictionary<ExposureMeasure, double> { [ExposureMeasure.SpreadLevel] = total },
            BySpreadGroup = new Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>
            {
                ["corp-bbb"] = new Dictionary<ExposureMeasure, double> { [ExposureMeasure.SpreadLevel] = bbb },
                ["corp-a"] = new Dictionary<ExposureMeasure, double> { [ExposureMeasure.SpreadLevel] = a },
            },
        };

        Assert.Empty(set.UpdateBook("credit-a", Figures(total: 500, bbb: 40, a: 460), Now));
        var change = Assert.Single(set.UpdateBook("credit-bbb", Figures(total: 90, bbb: 50, a: 40), Now));
        Assert.Equal(90, change.Exposure); // 40 + 50 of corp-bbb; totals 590 ignored
        Assert.Equal(LimitStatus.Warning, change.Current);
        Assert.Equal(590, set.ExposureOf(LimitScope.Desk("credit"), ExposureMeasure.SpreadLevel));

        // A totals-only update leaves no group figures: the group exposure falls to the other book's 40.
        change = Assert.Single(set.UpdateBook("credit-bbb", new Dictionary<ExposureMeasure, double> { [ExposureMeasure.SpreadLevel] = 90 }, Now));
        Assert.Equal((40.0, LimitStatus.Within), (change.Exposure, change.Current));
    }

    [Fact]
    public void Non_finite_group_figure_is_rejected_naming_the_group()
    {
        var set = new LimitSet(BookHierarchyTests.Sample(), []);
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => set.UpdateBook("credit-a", new BookExposures
        {
            Totals = new Dictionary<ExposureMeasure, double>(),
            BySpreadGroup = new Dictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>
            {
                ["corp-a"] = new Dictionary<ExposureMeasure, double> { [ExposureMeasure.Dv01] = double.NaN },
            },
        }, Now));
        Assert.Contains("spread group 'corp-a'", e.Message, StringComparison.Ordinal);
    }
}
