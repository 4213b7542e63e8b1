using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class LimitSetPropertyTests
{
    private static readonly string[] Books = ["govt-short", "govt-long", "credit-a", "credit-bbb"];

    // Aggregation: after any sequence of book updates, the desk and firm exposures are the sums of
    // each book's LAST figures (money figures add; domain primer, "Factor durations").
    [Property(MaxTest = 200)]
    public Property Scope_exposure_is_the_sum_of_the_latest_book_figures()
    {
        var updates = Gen.ListOf(
            from book in Gen.Elements(Books)
            from value in Gen.Choose(-1_000_000, 1_000_000)
            select (book, value: (double)value));

        return Prop.ForAll(Arb.From(updates), list =>
        {
            var set = new LimitSet(BookHierarchyTests.Sample(), []);
            var latest = new Dictionary<string, double>();
            foreach (var (book, value) in list)
            {
                set.UpdateBook(book, new Dictionary<ExposureMeasure, double> { [ExposureMeasure.Dv01] = value }, DateTimeOffset.UnixEpoch);
                latest[book] = value;
            }

            double Sum(params string[] books) => books.Sum(b => latest.GetValueOrDefault(b));
            return set.ExposureOf(LimitScope.Desk("rates"), ExposureMeasure.Dv01) == Sum("govt-short", "govt-long")
                && set.ExposureOf(LimitScope.Desk("credit"), ExposureMeasure.Dv01) == Sum("credit-a", "credit-bbb")
                && set.ExposureOf(LimitScope.Firm("demo-firm"), ExposureMeasure.Dv01) == Sum(Books);
        });
    }
}
