using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class BookHierarchyTests
{
    internal static BookHierarchy Sample() => new("demo-firm", new Dictionary<string, IReadOnlyList<string>>
    {
        ["rates"] = ["govt-short", "govt-long"],
        ["credit"] = ["credit-a", "credit-bbb"],
        ["new-desk"] = [],
    });

    [Fact]
    public void Book_maps_to_its_desk_and_covering_scopes()
    {
        var h = Sample();
        Assert.Equal("rates", h.DeskOf("govt-long"));
        Assert.Equal(
            [LimitScope.Book("credit-a"), LimitScope.Desk("credit"), LimitScope.Firm("demo-firm")],
            h.ScopesCovering("credit-a"));
        Assert.Equal(4, h.BooksUnder(LimitScope.Firm("demo-firm")).Count);
        Assert.Empty(h.BooksUnder(LimitScope.Desk("new-desk")));
    }

    [Fact]
    public void Book_under_two_desks_is_rejected_naming_both()
    {
        var e = Assert.Throws<ArgumentException>(() => new BookHierarchy("f", new Dictionary<string, IReadOnlyList<string>>
        {
            ["a"] = ["x"],
            ["b"] = ["x"],
        }));
        Assert.Contains("'x'", e.Message, StringComparison.Ordinal);
        Assert.Contains("'a'", e.Message, StringComparison.Ordinal);
        Assert.Contains("'b'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_book_is_named()
    {
        var e = Assert.Throws<KeyNotFoundException>(() => Sample().DeskOf("nope"));
        Assert.Contains("'nope'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Same_tree_ignores_order_but_sees_a_moved_book()
    {
        var reordered = new BookHierarchy("demo-firm", new Dictionary<string, IReadOnlyList<string>>
        {
            ["credit"] = ["credit-bbb", "credit-a"],
            ["new-desk"] = [],
            ["rates"] = ["govt-long", "govt-short"],
        });
        Assert.True(Sample().SameTreeAs(reordered));
        var moved = new BookHierarchy("demo-firm", new Dictionary<string, IReadOnlyList<string>>
        {
            ["rates"] = ["govt-short", "govt-long", "credit-a"],
            ["credit"] = ["credit-bbb"],
            ["new-desk"] = [],
        });
        Assert.False(Sample().SameTreeAs(moved));
    }
}
