using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class LimitSetTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 1, 10, 0, 0, TimeSpan.Zero);

    private static LimitDefinition Limit(string id, LimitScope scope, double upper, ExposureMeasure measure = ExposureMeasure.Dv01) => new()
    {
        Id = id,
        Scope = scope,
        Measure = measure,
        Upper = upper,
        WarningFraction = 0.8, // common practice, no source
        HysteresisFraction = 0.05, // common practice, no source
    };

    private static Dictionary<ExposureMeasure, double> Dv01(double value, double marketValue = 0) => new()
    {
        [ExposureMeasure.Dv01] = value,
        [ExposureMeasure.MarketValue] = marketValue,
    };

    private static LimitSet Sample() => new(BookHierarchyTests.Sample(),
    [
        Limit("book-short", LimitScope.Book("govt-short"), 100),
        Limit("book-long", LimitScope.Book("govt-long"), 100),
        Limit("desk-rates", LimitScope.Desk("rates"), 150),
        Limit("desk-credit", LimitScope.Desk("credit"), 150),
        Limit("firm", LimitScope.Firm("demo-firm"), 250),
        Limit("firm-mv", LimitScope.Firm("demo-firm"), 1000, ExposureMeasure.MarketValue),
    ]);

    // Desk and firm figures are sums of book money figures (domain primer, "Factor durations":
    // book figures are sums of dollar figures).
    [Fact]
    public void Desk_and_firm_exposures_are_sums_of_their_books()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(10, 300), Now);
        set.UpdateBook("govt-long", Dv01(20, 400), Now);
        set.UpdateBook("credit-a", Dv01(-5, 100), Now);
        Assert.Equal(30, set.ExposureOf(LimitScope.Desk("rates"), ExposureMeasure.Dv01));
        Assert.Equal(-5, set.ExposureOf(LimitScope.Desk("credit"), ExposureMeasure.Dv01));
        Assert.Equal(25, set.ExposureOf(LimitScope.Firm("demo-firm"), ExposureMeasure.Dv01));
        Assert.Equal(800, set.ExposureOf(LimitScope.Firm("demo-firm"), ExposureMeasure.MarketValue));
        Assert.Equal(0, set.ExposureOf(LimitScope.Book("credit-bbb"), ExposureMeasure.Dv01));
    }

    [Fact]
    public void A_book_update_replaces_the_previous_figures_rather_than_adding()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(10), Now);
        set.UpdateBook("govt-short", Dv01(12), Now);
        Assert.Equal(12, set.ExposureOf(LimitScope.Desk("rates"), ExposureMeasure.Dv01));
    }

    [Fact]
    public void A_book_change_evaluates_its_book_desk_and_firm_only()
    {
        var set = Sample();
        // govt-long at 90 -> book-long warning (0.9); desk rates 90/150 = 0.6; firm 90/250.
        var changes = set.UpdateBook("govt-long", Dv01(90), Now);
        var change = Assert.Single(changes);
        Assert.Equal("book-long", change.LimitId);
        Assert.Equal(LimitStatus.Warning, change.Current);

        // govt-short at 40: desk rates 130/150 = 0.867 -> warning; book-short 0.4 stays within.
        changes = set.UpdateBook("govt-short", Dv01(40), Now);
        Assert.Equal(["desk-rates"], changes.Select(c => c.LimitId));
        Assert.Equal(130, changes[0].Exposure);
        Assert.Equal(150, changes[0].LimitValue);

        // A credit book reaching 240 drives credit desk to breach and the firm (370/250) to breach,
        // never touching the rates limits.
        changes = set.UpdateBook("credit-bbb", Dv01(240), Now);
        Assert.Equal(["desk-credit", "firm"], changes.Select(c => c.LimitId));
        Assert.All(changes, c => Assert.Equal(LimitStatus.Breach, c.Current));
        Assert.Equal(LimitStatus.Warning, set.StatusOf("desk-rates"));
    }

    [Fact]
    public void Clear_reports_breach_to_within()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(120), Now);
        var changes = set.UpdateBook("govt-short", Dv01(10), Now);
        var c = Assert.Single(changes, x => x.LimitId == "book-short");
        Assert.Equal((LimitStatus.Breach, LimitStatus.Within), (c.Previous, c.Current));
    }

    [Fact]
    public void What_if_reports_without_changing_state()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(10), Now);
        var changes = set.WhatIf("govt-short", Dv01(200), Now);
        Assert.Contains(changes, c => c.LimitId == "book-short" && c.Current == LimitStatus.Breach);
        Assert.Equal(LimitStatus.Within, set.StatusOf("book-short"));
        Assert.Equal(10, set.ExposuresOf("govt-short")[ExposureMeasure.Dv01]);
        Assert.Empty(set.WhatIf("credit-a", Dv01(1), Now));
        Assert.Empty(set.ExposuresOf("credit-a"));
    }

    [Fact]
    public void Unknown_book_and_non_finite_exposure_are_rejected_and_leave_state_untouched()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(10), Now);
        Assert.Throws<KeyNotFoundException>(() => set.UpdateBook("ghost", Dv01(1), Now));
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => set.UpdateBook("govt-short", Dv01(double.PositiveInfinity), Now));
        Assert.Contains("govt-short", e.Message, StringComparison.Ordinal);
        Assert.Contains("Dv01", e.Message, StringComparison.Ordinal);
        Assert.Equal(10, set.ExposureOf(LimitScope.Book("govt-short"), ExposureMeasure.Dv01));
    }

    [Fact]
    public void Invalid_definitions_are_all_reported()
    {
        var e = Assert.Throws<LimitConfigurationException>(() => new LimitSet(BookHierarchyTests.Sample(),
        [
            Limit("a", LimitScope.Book("ghost-book"), 100),
            Limit("a", LimitScope.Desk("rates"), 100),
            Limit("c", LimitScope.Desk("fx"), 100) with { WarningFraction = 1.2 },
        ]));
        Assert.Equal(4, e.Errors.Count);
        Assert.Contains(e.Errors, m => m.Contains("book:ghost-book is not in the book hierarchy", StringComparison.Ordinal));
        Assert.Contains(e.Errors, m => m.Contains("\"a\" is used twice", StringComparison.Ordinal));
        Assert.Contains(e.Errors, m => m.Contains("desk:fx", StringComparison.Ordinal));
        Assert.Contains(e.Errors, m => m.Contains("WarningFraction: 1.2 is above 1", StringComparison.Ordinal));
    }

    [Fact]
    public void Expired_temporary_limit_is_not_evaluated_and_can_be_removed()
    {
        var temporary = Limit("temp", LimitScope.Book("govt-short"), 50) with { ExpiresAt = Now.AddHours(1) };
        var set = new LimitSet(BookHierarchyTests.Sample(), [temporary]);
        Assert.Single(set.UpdateBook("govt-short", Dv01(60), Now));
        Assert.Equal(LimitStatus.Breach, set.StatusOf("temp"));
        Assert.Empty(set.UpdateBook("govt-short", Dv01(1), Now.AddHours(1)));
        Assert.Empty(set.CurrentUse(Now.AddHours(1)));
        var expired = Assert.Single(set.RemoveExpired(Now.AddHours(2)));
        Assert.Equal(("temp", LimitStatus.Breach), (expired.Limit.Id, expired.LastStatus));
        Assert.Equal((LimitStatus.Breach, LimitStatus.Expired, 1.0), (expired.Change.Previous, expired.Change.Current, expired.Change.Exposure));
        Assert.Empty(set.Limits);
    }

    [Fact]
    public void Current_use_lists_every_limit_with_exposure_and_utilisation()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(50), Now);
        var use = set.CurrentUse(Now).Single(u => u.Limit.Id == "desk-rates");
        Assert.Equal(50, use.Exposure);
        Assert.Equal(150, use.Bound);
        Assert.Equal(1.0 / 3, use.Utilisation, 12);
    }

    // Reload: unchanged limits keep their status, modified ones are re-evaluated from their previous
    // status, added ones from Within, removed ones end as Retired and are gone.
    [Fact]
    public void Reload_reports_added_removed_modified_and_keeps_unchanged_statuses()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(90), Now); // book-short warning (0.9)
        set.UpdateBook("govt-long", Dv01(78), Now); // book-long within (0.78); desk rates 168/150 breach
        Assert.Equal(LimitStatus.Breach, set.StatusOf("desk-rates"));

        var newLimits = new List<LimitDefinition>
        {
            Limit("book-short", LimitScope.Book("govt-short"), 100), // unchanged
            Limit("book-long", LimitScope.Book("govt-long"), 90), // tighter: 78/90 = 0.87 -> warning
            Limit("desk-rates", LimitScope.Desk("rates"), 400), // looser: 168/400 = 0.42 -> within
            Limit("firm", LimitScope.Firm("demo-firm"), 250), // unchanged
            Limit("credit-a-dv01", LimitScope.Book("credit-a"), 10), // added, no exposure yet
        };
        var result = set.Reload(BookHierarchyTests.Sample(), newLimits, Now);

        Assert.Equal(["credit-a-dv01"], result.Added.Select(l => l.Id));
        Assert.Equal(["desk-credit", "firm-mv"], result.Removed.Select(l => l.Id).Order());
        Assert.Equal(["book-long", "desk-rates"], result.Modified.Select(m => m.After.Id).Order());
        Assert.False(result.HierarchyChanged);
        Assert.Empty(result.DroppedBooks);
        Assert.Equal(
            [("book-long", LimitStatus.Within, LimitStatus.Warning), ("desk-credit", LimitStatus.Within, LimitStatus.Retired),
                ("desk-rates", LimitStatus.Breach, LimitStatus.Within), ("firm-mv", LimitStatus.Within, LimitStatus.Retired)],
            result.StatusChanges.Select(c => (c.LimitId, c.Previous, c.Current)).OrderBy(t => t.LimitId));
        Assert.Equal(LimitStatus.Warning, set.StatusOf("book-short"));
        Assert.Throws<KeyNotFoundException>(() => set.StatusOf("desk-credit"));
    }

    [Fact]
    public void Reload_keeps_a_held_status_of_an_unchanged_limit_inside_its_band()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(85), Now); // warning
        set.UpdateBook("govt-short", Dv01(77), Now); // inside the band: still warning
        Assert.Equal(LimitStatus.Warning, set.StatusOf("book-short"));
        var result = set.Reload(BookHierarchyTests.Sample(), set.Limits.ToList(), Now);
        Assert.True(result.IsEmpty);
        Assert.Empty(result.StatusChanges);
        Assert.Equal(LimitStatus.Warning, set.StatusOf("book-short")); // a fresh set would say Within
    }

    [Fact]
    public void Reload_with_a_new_hierarchy_drops_unlisted_books_and_reaggregates()
    {
        var set = Sample();
        set.UpdateBook("govt-short", Dv01(100), Now);
        set.UpdateBook("credit-a", Dv01(100), Now);
        set.UpdateBook("credit-bbb", Dv01(7), Now);
        var hierarchy = new BookHierarchy("demo-firm", new Dictionary<string, IReadOnlyList<string>>
        {
            ["rates"] = ["govt-short", "credit-a"], // credit-a moved to rates
            ["credit"] = [], // credit-bbb closed
        });
        var result = set.Reload(hierarchy, [Limit("desk-rates", LimitScope.Desk("rates"), 150)], Now);
        Assert.True(result.HierarchyChanged);
        Assert.Equal(["credit-bbb"], result.DroppedBooks);
        Assert.Equal(200, set.ExposureOf(LimitScope.Firm("demo-firm"), ExposureMeasure.Dv01));
        var change = Assert.Single(result.StatusChanges, c => c.Current != LimitStatus.Retired);
        Assert.Equal(200, change.Exposure);
        Assert.Equal(LimitStatus.Breach, change.Current);
    }

    [Fact]
    public void Invalid_reload_keeps_the_current_configuration()
    {
        var set = Sample();
        Assert.Throws<LimitConfigurationException>(() => set.Reload(BookHierarchyTests.Sample(), [Limit("x", LimitScope.Desk("fx"), 1)], Now));
        Assert.Equal(6, set.Limits.Count);
    }
}
