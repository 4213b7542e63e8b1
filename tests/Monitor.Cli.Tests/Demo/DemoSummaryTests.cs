using Monitor.Cli.Demo;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Tests.Demo;

/// <summary>How the demo names status changes and measures breach durations (our own conventions; common practice, no source).</summary>
public sealed class DemoSummaryTests
{
    private static readonly DateTimeOffset Day = new(2026, 6, 1, 0, 0, 0, TimeSpan.Zero);

    [Theory]
    [InlineData("within", "warning", "Warning")]
    [InlineData("within", "breach", "Breach")]
    [InlineData("warning", "breach", "Breach")]
    [InlineData("breach", "warning", "Clear")]
    [InlineData("breach", "within", "Clear")]
    [InlineData("warning", "within", "Clear")]
    public void A_change_is_named_by_its_direction(string previous, string current, string expected) =>
        Assert.Equal(Enum.Parse<StatusChangeKind>(expected), ObservedStatusChange.From(Change("l1", previous, current, Day), _ => null).Kind);

    [Fact]
    public void A_breach_lasts_from_its_start_until_it_steps_down_and_an_open_one_has_no_end()
    {
        var changes = new[]
        {
            ObservedStatusChange.From(Change("a", "within", "breach", Day.AddHours(13.25)), _ => null),
            ObservedStatusChange.From(Change("b", "warning", "breach", Day.AddHours(14)), _ => null),
            ObservedStatusChange.From(Change("a", "breach", "warning", Day.AddHours(14.75)), _ => null),
        };

        var breaches = DemoSummary.Breaches(changes).ToList();

        Assert.Equal(2, breaches.Count);
        var a = Assert.Single(breaches, b => b.Limit == "a");
        Assert.Equal(TimeSpan.FromMinutes(90), a.To!.Value - a.From);
        Assert.Null(Assert.Single(breaches, b => b.Limit == "b").To);
    }

    [Theory]
    [InlineData("TradeBooked", true, "after trade T-42")]
    [InlineData("TradeBooked", false, "after a trade")]
    [InlineData("BondQuoted", false, "after a curve refit")]
    [InlineData("refit", false, "after a curve refit")]
    [InlineData("limits-file", false, "after a limits reload")]
    [InlineData("journal-replay", false, "on restart (journal replayed)")]
    public void A_cause_is_printed_in_words_never_as_a_type_name(string type, bool known, string expected)
    {
        var id = Guid.NewGuid();
        var message = Change("a", "within", "breach", Day) with { CauseMessageType = type, CauseMessageId = id };
        var change = ObservedStatusChange.From(message, m => known && m == id ? "T-42" : null);
        Assert.Equal(expected, change.Cause);
        Assert.EndsWith(", " + expected, DemoFormat.StatusLine(change), StringComparison.Ordinal);
    }

    private static LimitStatusChanged Change(string limit, string previous, string current, DateTimeOffset at) => new()
    {
        LimitId = limit,
        Scope = "book",
        ScopeId = "RATES-CURVE",
        Measure = "dv01",
        Status = current,
        PreviousStatus = previous,
        Exposure = 1,
        Limit = 1,
        Utilisation = 1,
        Curves = [],
        CauseMessageType = "TradeBooked",
        EventTime = at,
        ProcessedAt = at,
    };
}
