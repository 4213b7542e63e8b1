using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Issue 10, "Business days, not UTC dates": a restart replays every journal day since the start-of-day state, so one
/// after midnight or after a weekend, on the same start-of-day files, has the same books; day files are named by the
/// configured business date.
/// </summary>
public class BusinessDayRestartTests
{
    // Quotes of the opening file are days old after a weekend: no opening fit, the books are compared by positions and trades.
    private static readonly Dictionary<string, string?> NoOpeningQuotes = new() { ["Monitor:OpeningQuotesFile"] = null };

    [Fact]
    public async Task Trades_in_the_evening_survive_a_restart_after_midnight()
    {
        using var root = new TempFolder();
        var evening = new DateTimeOffset(2026, 6, 1, 20, 0, 0, TimeSpan.Zero);
        string before;
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path, now: evening, settings: NoOpeningQuotes))
        {
            await first.TradeAsync(ServiceUnderTest.Trade("E-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000, evening));
            await first.TradeAsync(ServiceUnderTest.Trade("E-2", 1, "new", "RATES-CURVE", "VGB-2051-11", -3_000_000, evening));
            before = await Books(first);
        }

        await using var second = await ServiceUnderTest.StartAsync(root: root.Path, now: evening.AddHours(5), settings: NoOpeningQuotes);
        Assert.Equal(before, await Books(second));
        Assert.EndsWith("trades 2", before, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Trades_on_friday_survive_a_restart_on_monday()
    {
        using var root = new TempFolder();
        var friday = new DateTimeOffset(2026, 6, 5, 15, 0, 0, TimeSpan.Zero);
        string before;
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path, now: friday.AddHours(-6), settings: NoOpeningQuotes))
        {
            await first.TradeAsync(ServiceUnderTest.Trade("F-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000, friday.AddHours(-6)));
        }
        // Started again on Friday afternoon (same start-of-day files), then stopped over the weekend.
        await using (var again = await ServiceUnderTest.StartAsync(root: root.Path, now: friday, settings: NoOpeningQuotes))
        {
            await again.TradeAsync(ServiceUnderTest.Trade("F-2", 1, "new", "RATES-CURVE", "VGB-2051-11", -3_000_000, friday));
            await again.TradeAsync(ServiceUnderTest.Trade("F-1", 2, "amend", "RATES-CORE", "VGB-2031-05", 7_000_000, friday));
            before = await Books(again);
        }

        var monday = new DateTimeOffset(2026, 6, 8, 7, 0, 0, TimeSpan.Zero);
        await using var third = await ServiceUnderTest.StartAsync(root: root.Path, now: monday, settings: NoOpeningQuotes);
        Assert.Equal(before, await Books(third));
        Assert.EndsWith("trades 2", before, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Day_files_are_named_by_the_configured_business_date()
    {
        using var root = new TempFolder();
        // 22:00Z on 1 June is 18:00 in New York (EDT), after a 17:00 roll: business date 2 June.
        var settings = new Dictionary<string, string?>(NoOpeningQuotes)
        {
            ["Monitor:BusinessDay:RollTime"] = "17:00",
            ["Monitor:BusinessDay:TimeZone"] = "America/New_York",
        };
        var late = new DateTimeOffset(2026, 6, 1, 22, 0, 0, TimeSpan.Zero);
        await using var service = await ServiceUnderTest.StartAsync(root: root.Path, now: late, settings: settings);
        await service.TradeAsync(ServiceUnderTest.Trade("N-1", 1, "new", "RATES-CORE", "VGB-2031-05", 1_000_000, late));

        Assert.True(File.Exists(Path.Combine(service.LogFolder, "exposures-2026-06-02.jsonl")));
        Assert.True(File.Exists(JournalFiles.PathOf(service.LogFolder + "-journal", new DateOnly(2026, 6, 2))));
        Assert.False(File.Exists(JournalFiles.PathOf(service.LogFolder + "-journal", new DateOnly(2026, 6, 1))));
    }

    [Fact]
    public async Task A_new_positions_file_starts_a_new_start_of_day_state()
    {
        using var root = new TempFolder();
        var evening = new DateTimeOffset(2026, 6, 1, 20, 0, 0, TimeSpan.Zero);
        var positions = Path.Combine(root.Path, "positions.csv");
        File.Copy(TestMarket.Data("positions.csv"), positions);
        var settings = new Dictionary<string, string?>(NoOpeningQuotes) { ["Monitor:PositionsFile"] = positions };
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path, now: evening, settings: settings))
        {
            await first.TradeAsync(ServiceUnderTest.Trade("P-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000, evening));
        }

        // The next day's positions file takes the trade in: yesterday's journal is not replayed on top of it.
        File.AppendAllText(positions, "RATES-CORE,VGB-2031-05,5000000\n");
        await using var second = await ServiceUnderTest.StartAsync(root: root.Path, now: evening.AddHours(13), settings: settings);
        Assert.Equal(0, await second.Pipeline.ReadAsync(e => e.Trades.Count));
        var state = File.ReadAllText(Path.Combine(second.LogFolder + "-journal", StartOfDayState.FileName));
        Assert.Contains("\"businessDate\":\"2026-06-02\"", state, StringComparison.Ordinal);
    }

    private static Task<string> Books(ServiceUnderTest service) => service.Pipeline.ReadAsync(e =>
        string.Join("; ", e.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal)
            .Select(b => $"{b.Id} [{string.Join(",", b.Positions.OrderBy(p => p.Key, StringComparer.Ordinal).Select(p => $"{p.Key}={p.Value:R}"))}]"))
        + $" | trades {e.Trades.Count}");
}
