using Monitor.Limits;

namespace Monitor.Limits.Tests;

/// <summary>
/// <see cref="LimitSet.UpdateBooks"/> against the one-at-a-time <see cref="LimitSet.UpdateBook(string, BookExposures, DateTimeOffset)"/>.
/// Status rule: warning at 80%, 5% band (common practice, no source).
/// </summary>
public class LimitSetBatchUpdateTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 1, 10, 0, 0, TimeSpan.Zero);

    private static LimitDefinition Limit(string id, LimitScope scope, double upper) => new()
    {
        Id = id,
        Scope = scope,
        Measure = ExposureMeasure.Dv01,
        Upper = upper,
        WarningFraction = 0.8,
        HysteresisFraction = 0.05,
    };

    private static LimitSet Sample() => new(BookHierarchyTests.Sample(),
    [
        Limit("book-short", LimitScope.Book("govt-short"), 100),
        Limit("book-long", LimitScope.Book("govt-long"), 100),
        Limit("desk-rates", LimitScope.Desk("rates"), 150),
        Limit("firm", LimitScope.Firm("demo-firm"), 250),
    ]);

    private static BookExposures Dv01(double value) => BookExposures.FromTotals(new Dictionary<ExposureMeasure, double> { [ExposureMeasure.Dv01] = value });

    [Fact]
    public void The_batch_reports_book_then_desk_then_firm_and_leaves_the_same_state_as_one_at_a_time()
    {
        var batch = Sample();
        var single = Sample();
        (string, BookExposures)[] updates = [("govt-short", Dv01(90)), ("govt-long", Dv01(95)), ("credit-a", Dv01(70))];

        var changes = batch.UpdateBooks(updates, Now);
        foreach (var (book, figures) in updates)
        {
            single.UpdateBook(book, figures, Now);
        }

        // 90 and 95 of 100: warning; rates 185 of 150: breach; firm 255 of 250: breach.
        Assert.Equal(["book-short", "book-long", "desk-rates", "firm"], changes.Select(c => c.LimitId));
        Assert.Equal([LimitStatus.Warning, LimitStatus.Warning, LimitStatus.Breach, LimitStatus.Breach], changes.Select(c => c.Current));
        Assert.All(batch.Limits, l => Assert.Equal(single.StatusOf(l.Id), batch.StatusOf(l.Id)));
        Assert.Equal(255, batch.ExposureOf(LimitScope.Firm("demo-firm"), ExposureMeasure.Dv01));
    }

    [Fact]
    public void The_firm_is_judged_once_on_all_new_figures_not_on_each_intermediate_sum()
    {
        var batch = Sample();
        var single = Sample();
        (string, BookExposures)[] opening = [("govt-short", Dv01(10)), ("govt-long", Dv01(10)), ("credit-a", Dv01(210))];
        batch.UpdateBooks(opening, Now);
        foreach (var (book, figures) in opening)
        {
            single.UpdateBook(book, figures, Now);
        }
        Assert.Equal(LimitStatus.Warning, batch.StatusOf("firm")); // 230 of 250

        // Risk moves between books: the firm total stays 230, but one at a time it passes through 300 on the way.
        (string, BookExposures)[] move = [("govt-short", Dv01(80)), ("credit-a", Dv01(140))];
        var batched = batch.UpdateBooks(move, Now);
        var oneByOne = move.SelectMany(u => single.UpdateBook(u.Item1, u.Item2, Now)).ToList();

        Assert.DoesNotContain(batched, c => c.LimitId == "firm");
        Assert.Contains(oneByOne, c => c.LimitId == "firm" && c.Current == LimitStatus.Breach); // the artefact the batch avoids
        Assert.Equal(LimitStatus.Warning, batch.StatusOf("firm"));
    }

    [Fact]
    public void A_bad_figure_anywhere_in_the_batch_changes_nothing()
    {
        var set = Sample();
        set.UpdateBooks([("govt-short", Dv01(10))], Now);
        var bad = BookExposures.FromTotals(new Dictionary<ExposureMeasure, double> { [ExposureMeasure.Dv01] = double.NaN });

        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => set.UpdateBooks([("govt-long", Dv01(50)), ("credit-a", bad)], Now));

        Assert.Contains("credit-a", ex.Message, StringComparison.Ordinal);
        Assert.Equal(10, set.ExposureOf(LimitScope.Firm("demo-firm"), ExposureMeasure.Dv01)); // govt-long's 50 not taken either
    }
}
