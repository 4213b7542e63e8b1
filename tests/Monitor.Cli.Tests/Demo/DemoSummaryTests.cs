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
        Assert.Equal(Enum.Parse<StatusChangeKind>(expected), ObservedStatusChange.From(Change("l1", previous, current, Day)).Kind);

    [Fact]
    public void A_breach_lasts_from_its_start_until_it_steps_down_and_an_open_one_has_no_end()
    {
        var changes = new[]
        {
            ObservedStatusChange.From(Change("a", "within", "breach", Day.AddHours(13.25))),
            ObservedStatusChange.From(Change("b", "warning", "breach", Day.AddHours(14))),
            ObservedStatusChange.From(Change("a", "breach", "warning", Day.AddHours(14.75))),
        };

        var breaches = DemoSummary.Breaches(changes).ToList();

        Assert.Equal(2, breaches.Count);
        var a = Assert.Single(breaches, b => b.Limit == "a");
        Assert.Equal(TimeSpan.FromMinutes(90), a.To!.Value - a.From);
        Assert.Null(Assert.Single(breaches, b => b.Limit == "b").To);
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
