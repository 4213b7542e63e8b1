using Monitor.Limits;

namespace Monitor.Limits.Tests;

/// <summary>
/// A limit that leaves the set ends on record: removed by a reload it ends as Retired, a temporary limit past its
/// expiry as Expired, each with a status change carrying its last standing. Thresholds 80% / 5% band (common practice,
/// no source); the arithmetic of each figure is written beside it.
/// </summary>
public class LimitEndTests
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

    private static Dictionary<ExposureMeasure, double> Dv01(double value) => new() { [ExposureMeasure.Dv01] = value };

    private static LimitSet Sample() => new(BookHierarchyTests.Sample(),
    [
        Limit("book-short", LimitScope.Book("govt-short"), 100),
        Limit("desk-rates", LimitScope.Desk("rates"), 150),
    ]);

    [Fact]
    public void A_limit_removed_while_in_breach_ends_as_retired_and_the_reload_is_flagged()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(120), Now); // book-short 120/100 = 1.2: breach; desk 120/150 = 0.8: warning
        Assert.Equal(LimitStatus.Breach, set.StatusOf("book-short"));

        var result = set.Reload(BookHierarchyTests.Sample(), [Limit("desk-rates", LimitScope.Desk("rates"), 150)], Now);

        var retired = Assert.Single(result.StatusChanges);
        Assert.Equal(("book-short", LimitStatus.Breach, LimitStatus.Retired), (retired.LimitId, retired.Previous, retired.Current));
        Assert.Equal((120.0, 100.0, 1.2), (retired.Exposure, retired.LimitValue, retired.Utilisation));
        Assert.Equal(1, result.LimitCount);
        var flag = Assert.Single(result.Flags);
        Assert.Contains("'book-short'", flag, StringComparison.Ordinal);
        Assert.Contains("breach", flag, StringComparison.Ordinal);
        Assert.Throws<KeyNotFoundException>(() => set.StatusOf("book-short"));
    }

    [Fact]
    public void A_reload_that_removes_every_limit_is_flagged_even_when_all_were_within()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(10), Now);

        var result = set.Reload(BookHierarchyTests.Sample(), [], Now);

        Assert.Equal(["book-short", "desk-rates"], result.StatusChanges.Where(c => c.Current == LimitStatus.Retired).Select(c => c.LimitId).Order());
        Assert.Equal(0, result.LimitCount);
        Assert.Contains("removes every limit (2)", Assert.Single(result.Flags), StringComparison.Ordinal);
    }

    [Fact]
    public void A_reload_that_removes_a_limit_within_its_bounds_is_not_flagged()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(10), Now);

        var result = set.Reload(BookHierarchyTests.Sample(), [Limit("desk-rates", LimitScope.Desk("rates"), 150)], Now);

        Assert.Equal(LimitStatus.Retired, Assert.Single(result.StatusChanges).Current);
        Assert.Empty(result.Flags);
    }

    [Fact]
    public void A_temporary_limit_ends_as_expired_once_the_given_time_reaches_its_expiry()
    {
        var temporary = Limit("temp", LimitScope.Book("govt-short"), 50) with { ExpiresAt = Now.AddHours(1) };
        var set = new LimitSet(BookHierarchyTests.Sample(), [temporary, Limit("desk-rates", LimitScope.Desk("rates"), 150)]);
        set.UpdateBook("govt-short", Dv01(45), Now); // 45/50 = 0.9: warning

        Assert.Empty(set.RemoveExpired(Now.AddHours(1).AddTicks(-1))); // expiry is exclusive: still in force just before
        var expired = Assert.Single(set.RemoveExpired(Now.AddHours(1)));

        Assert.Equal(("temp", LimitStatus.Warning, LimitStatus.Expired), (expired.Change.LimitId, expired.Change.Previous, expired.Change.Current));
        Assert.Equal(0.9, expired.Change.Utilisation, 12);
        Assert.Equal(["desk-rates"], set.Limits.Select(l => l.Id));
        Assert.Empty(set.RemoveExpired(Now.AddHours(2))); // ends once
    }

    [Fact]
    public void The_status_rule_refuses_to_judge_an_ended_limit()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => LimitEvaluator.Next(LimitStatus.Retired, 0.5, 0.8, 0.05));
    }
}
