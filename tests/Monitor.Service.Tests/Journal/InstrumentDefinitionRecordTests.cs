using System.Text.Json;
using Microsoft.Extensions.Time.Testing;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Contracts.V1;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Issue 10, "Everything that changes a figure is on record": an instrument defined or redefined by message is
/// journalled before the engine takes it, logged with its old and new definitions, and replayed in order with the
/// trades; a journalled trade or definition the engine refuses on replay stops the start, naming it and the reason.
/// </summary>
public class InstrumentDefinitionRecordTests
{
    private static InstrumentDefined Define(string id, string issuer, double coupon, DateOnly maturity) => new()
    {
        InstrumentId = id,
        Issuer = issuer,
        Currency = "XTS",
        CouponRate = coupon,
        Frequency = 2,
        DayCount = "ACT/ACT-ICMA",
        IssueDate = new DateOnly(2025, 3, 1),
        MaturityDate = maturity,
        Face = 100,
        SettlementLagDays = 1,
    };

    [Fact]
    public async Task Definitions_by_message_and_trades_on_them_survive_a_restart_and_are_logged_old_and_new()
    {
        using var root = new TempFolder();
        string instruments, books;
        await using (var first = await ServiceUnderTest.StartAsync(root: root.Path))
        {
            await DefineAsync(first, Define("VGB-2035-03", "Republic of Veloria", 0.0375, new DateOnly(2035, 3, 1)));
            await first.TradeAsync(ServiceUnderTest.Trade("D-1", 1, "new", "RATES-CORE", "VGB-2035-03", 4_000_000));
            // A held bond redefined (issuer renamed: the terms in use stay), and a coupon change on a bond no book holds.
            await DefineAsync(first, Define("VGB-2035-03", "Veloria Treasury", 0.0375, new DateOnly(2035, 3, 1)));
            var file = await first.Pipeline.ReadAsync(e => e.Instruments["VGB-2034-11"]);
            await DefineAsync(first, Define("VGB-2034-11", file.Issuer, 0.04125, file.MaturityDate) with { IssueDate = file.IssueDate });
            instruments = await InstrumentsAsync(first);
            books = await BooksAsync(first);
            Assert.Equal(0.04125m, await first.Pipeline.ReadAsync(e => e.Instruments["VGB-2034-11"].CouponRate));
        }

        await using var second = await ServiceUnderTest.StartAsync(root: root.Path);
        Assert.Equal(instruments, await InstrumentsAsync(second));
        Assert.Equal(books, await BooksAsync(second));
        Assert.Equal(0.04125m, await second.Pipeline.ReadAsync(e => e.Instruments["VGB-2034-11"].CouponRate));
        Assert.Equal("Veloria Treasury", await second.Pipeline.ReadAsync(e => e.Instruments["VGB-2035-03"].Issuer));

        var records = ServiceUnderTest.LogLines(second.LogFolder, ExposureLogKinds.InstrumentDefined)
            .Select(l => JsonDocument.Parse(l).RootElement.GetProperty("payload")).ToArray();
        Assert.Equal(3, records.Length);
        Assert.Equal(JsonValueKind.Null, records[0].GetProperty("previous").ValueKind);
        Assert.Equal("Republic of Veloria", records[1].GetProperty("previous").GetProperty("issuer").GetString());
        Assert.Equal("Veloria Treasury", records[1].GetProperty("definition").GetProperty("issuer").GetString());
        Assert.Equal(0.04m, records[2].GetProperty("previous").GetProperty("couponRate").GetDecimal());
        Assert.Equal(0.04125m, records[2].GetProperty("definition").GetProperty("couponRate").GetDecimal());
        Assert.True(second.VerifyLog().Intact);
    }

    [Fact]
    public async Task A_definition_line_reads_back_as_the_same_bond()
    {
        using var folder = new TempFolder();
        var bond = new Bond("KST-2036-01", "Kestrel Works", "INDU-BBB", "XTS", 0.05875m, 2, DayCountConvention.Thirty360BondBasis,
            new DateOnly(2025, 7, 15), new DateOnly(2026, 1, 31), new DateOnly(2036, 1, 31), 1000m, 2);
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = folder.Path }, new FakeTimeProvider(TestMarket.Now)))
        {
            await journal.AppendDefinitionAsync(bond);
        }

        var contents = JournalReplay.Read(TestKey.Value, folder.Path, new DateOnly(2026, 6, 1));
        Assert.Empty(contents.Problems);
        Assert.True(BondTerms.Same(bond, Assert.Single(contents.Definitions)));
    }

    [Fact]
    public async Task A_journalled_definition_refused_on_replay_stops_the_start_naming_it()
    {
        using var root = new TempFolder();
        // A coupon change on a bond the start-of-day positions hold: the engine refuses it.
        var held = new Bond("VGB-2031-05", "Republic of Veloria", null, "XTS", 0.05m, 2, DayCountConvention.ActActIcma,
            new DateOnly(2021, 5, 15), null, new DateOnly(2031, 5, 15));
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = Path.Combine(root.Path, "exposure-log-journal") }, new FakeTimeProvider(TestMarket.Now)))
        {
            await journal.AppendDefinitionAsync(held);
        }

        var ex = await Assert.ThrowsAnyAsync<Exception>(() => ServiceUnderTest.StartAsync(root: root.Path));
        var refused = Innermost<JournalReplayRefusedException>(ex);
        Assert.Contains("instrument definition VGB-2031-05", refused.Message, StringComparison.Ordinal);
        Assert.Contains("held in a book", refused.Message, StringComparison.Ordinal);
        Assert.Contains("journal-2026-06-01.jsonl", refused.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_journalled_trade_refused_on_replay_stops_the_start_naming_it()
    {
        using var root = new TempFolder();
        // A trade on an instrument defined only by a message whose definition is not in the journal (as before this change).
        var trade = new TradeInput("X-1", 1, TradeAction.New, "RATES-CORE", "VGB-2035-03", 1_000_000, 99, TestMarket.Now.AddMinutes(-5));
        await using (var journal = new TradeJournal(TestKey.Value, new JournalOptions { Folder = Path.Combine(root.Path, "exposure-log-journal") }, new FakeTimeProvider(TestMarket.Now)))
        {
            await journal.AppendTradeAsync(trade);
        }

        var ex = await Assert.ThrowsAnyAsync<Exception>(() => ServiceUnderTest.StartAsync(root: root.Path));
        var refused = Innermost<JournalReplayRefusedException>(ex);
        Assert.Contains("trade X-1 v1", refused.Message, StringComparison.Ordinal);
        Assert.Contains("VGB-2035-03", refused.Message, StringComparison.Ordinal);
    }

    private static async Task DefineAsync(ServiceUnderTest service, InstrumentDefined message)
    {
        var before = service.Harness.Consumed.Select<InstrumentDefined>().Count();
        await service.Harness.Bus.Publish(message);
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Consumed.Select<InstrumentDefined>().Count() > before, "definition consumed");
        Assert.Null(service.Harness.Consumed.Select<InstrumentDefined>().Last().Exception);
    }

    private static Task<string> InstrumentsAsync(ServiceUnderTest service) => service.Pipeline.ReadAsync(e =>
        string.Join("; ", e.Instruments.Values.OrderBy(b => b.Id, StringComparer.Ordinal)
            .Select(b => string.Join(" ", BondTerms.ToDictionary(b).Select(p => Convert.ToString(p.Value, System.Globalization.CultureInfo.InvariantCulture))))));

    private static Task<string> BooksAsync(ServiceUnderTest service) => service.Pipeline.ReadAsync(e =>
        string.Join("; ", e.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal)
            .Select(b => $"{b.Id} [{string.Join(",", b.Positions.OrderBy(p => p.Key, StringComparer.Ordinal).Select(p => $"{p.Key}={p.Value:R}"))}]"))
        + $" | trades {e.Trades.Count}");

    private static T Innermost<T>(Exception ex) where T : Exception
    {
        for (Exception? e = ex; e is not null; e = e.InnerException)
        {
            if (e is T found)
            {
                return found;
            }
        }
        throw new Xunit.Sdk.XunitException($"no {typeof(T).Name} in {ex}");
    }
}
