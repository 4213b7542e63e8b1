using System.Security.Cryptography;
using System.Text;
using Monitor.Service.Audit;
using Monitor.Service.Journal;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Journal;

/// <summary>
/// Issue 10, "Fail closed and reconcile": a journal line failing its check (a corrupt line mid-file, a line forged with
/// a recomputed plain SHA-256) stops the start with the file, line, trade and the way to proceed; so do books that
/// miss trades the exposure log records as applied. A torn last line is still cut back. On the unkeyed journal the
/// corrupt line was skipped with a warning (the trade left the books) and the forged one was replayed.
/// </summary>
public sealed class JournalFailsClosedTests : IDisposable
{
    private readonly TempFolder _root = new();

    public void Dispose() => _root.Dispose();

    private string JournalFile => Directory.GetFiles(Path.Combine(_root.Path, "exposure-log-journal"), "journal-*.jsonl").Single();

    private async Task BookTwoTradesAsync()
    {
        await using var first = await ServiceUnderTest.StartAsync(root: _root.Path);
        await first.TradeAsync(ServiceUnderTest.Trade("F-1", 1, "new", "RATES-CORE", "VGB-2031-05", 5_000_000));
        await first.TradeAsync(ServiceUnderTest.Trade("F-2", 1, "new", "RATES-CURVE", "VGB-2051-11", -3_000_000));
    }

    private async Task<JournalRejectedException> RestartRefusedAsync()
    {
        var ex = await Assert.ThrowsAnyAsync<Exception>(async () =>
        {
            await using var second = await ServiceUnderTest.StartAsync(root: _root.Path); // the engine, and with it the journal replay, is built here
        });
        return Find(ex) ?? throw new Xunit.Sdk.XunitException("not a JournalRejectedException: " + ex);
    }

    private static JournalRejectedException? Find(Exception? ex) => ex switch
    {
        null => null,
        JournalRejectedException rejected => rejected,
        AggregateException aggregate => aggregate.InnerExceptions.Select(Find).FirstOrDefault(e => e is not null),
        _ => Find(ex.InnerException),
    };

    private static int LineOf(string[] lines, string tradeId) =>
        Array.FindIndex(lines, l => l.Contains($"\"tradeId\":\"{tradeId}\"", StringComparison.Ordinal));

    [Fact]
    public async Task A_corrupt_line_mid_file_stops_the_start_naming_file_line_and_trade()
    {
        await BookTwoTradesAsync();
        var lines = File.ReadAllLines(JournalFile);
        var at = LineOf(lines, "F-1");
        lines[at] = lines[at].Replace("\"faceAmount\":5000000", "\"faceAmount\":5000001", StringComparison.Ordinal);
        File.WriteAllText(JournalFile, string.Concat(lines.Select(l => l + "\n")));

        var ex = await RestartRefusedAsync();

        Assert.Contains(Path.GetFileName(JournalFile), ex.Message, StringComparison.Ordinal);
        Assert.Contains($"line {at + 1}", ex.Message, StringComparison.Ordinal);
        Assert.Contains("trade F-1", ex.Message, StringComparison.Ordinal);
        Assert.Contains("MacMismatch", ex.Message, StringComparison.Ordinal);
        Assert.Contains("Journal:AcceptLoss", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_forged_trade_line_with_a_recomputed_plain_sha256_stops_the_start()
    {
        await BookTwoTradesAsync();
        var lines = File.ReadAllLines(JournalFile);
        var last = lines[^1];
        var prev = last[(last.LastIndexOf(",\"mac\":\"", StringComparison.Ordinal) + 8)..^2];
        var seq = lines.Length + 1;
        var canonical = "{\"format\":\"trade-journal/2\",\"seq\":" + seq + ",\"kind\":\"trade\",\"writtenTime\":\"2026-06-01T17:00:00.0000000Z\","
            + "\"trade\":{\"tradeId\":\"X-FORGED\",\"version\":1,\"action\":\"new\",\"book\":\"RATES-CURVE\",\"instrumentId\":\"VGB-2051-11\","
            + "\"faceAmount\":90000000,\"cleanPrice\":95,\"tradeTime\":\"2026-06-01T16:59:00.0000000+00:00\"},\"prevMac\":\"" + prev + "\"}";
        var forged = canonical[..^1] + ",\"mac\":\"" + Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(canonical))) + "\"}";
        File.AppendAllText(JournalFile, forged + "\n");

        var ex = await RestartRefusedAsync();

        Assert.Contains($"line {seq}", ex.Message, StringComparison.Ordinal);
        Assert.Contains("trade X-FORGED", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Books_missing_trades_the_log_records_as_applied_stop_the_start_naming_them()
    {
        await BookTwoTradesAsync();
        File.Delete(JournalFile);

        var ex = await RestartRefusedAsync();

        Assert.Contains("trade F-1 v1", ex.Message, StringComparison.Ordinal);
        Assert.Contains("trade F-2 v1", ex.Message, StringComparison.Ordinal);
        Assert.Contains("restore the journal day file", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Accepting_the_loss_starts_and_puts_each_loss_on_record()
    {
        await BookTwoTradesAsync();
        File.Move(JournalFile, JournalFile + ".set-aside");

        await using var second = await ServiceUnderTest.StartAsync(root: _root.Path, settings: new Dictionary<string, string?> { ["Journal:AcceptLoss"] = "true" });
        await second.Pipeline.WhenPublishedAsync();

        var losses = File.ReadLines(Directory.GetFiles(second.LogFolder, "exposures-*.jsonl").Single())
            .Where(l => l.Contains("\"kind\":\"journal-loss\"", StringComparison.Ordinal)).ToArray();
        Assert.Equal(2, losses.Length);
        Assert.Contains(losses, l => l.Contains("trade F-1 v1", StringComparison.Ordinal));
        Assert.True(ExposureLogVerifier.VerifyFolder(TestKey.Value, second.LogFolder).Intact);
    }

    [Fact]
    public async Task A_torn_last_line_is_still_cut_back_and_the_start_goes_on()
    {
        await BookTwoTradesAsync();
        File.AppendAllText(JournalFile, "{\"format\":\"trade-journal/2\",\"seq\":9,\"kind\":\"tra");

        await using var second = await ServiceUnderTest.StartAsync(root: _root.Path);

        Assert.Equal(2, await second.Pipeline.ReadAsync(e => e.Trades.Count));
    }
}
