using MassTransit.Testing;
using Monitor.Contracts.V1;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// No book left out, end to end: CREDIT-IG holds UTIL-A bonds, whose curve never fits in the test market (three quotes,
/// the gate asks for four). Its figures are published marked provisional, the credit desk's limit is judged on them and
/// says so, and the exposure log's records carry the mark. Status rule: warning at 80%, breach at 100%
/// (src/Monitor.Limits/README.md; common practice, no source).
/// </summary>
public sealed class ProvisionalFiguresTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task A_desk_limit_judged_on_a_book_without_its_spread_curve_breaches_marked_provisional()
    {
        // CREDIT-IG is worth tens of millions: a 1m bound on the credit desk's value breaches only if the book is counted.
        var limits = TestMarket.WriteLimits(_folder.Path,
            """{ "id": "t-credit-value", "scope": "desk", "scopeId": "credit", "measure": "marketValue", "upper": 1000000 }""");

        await using var service = await ServiceUnderTest.StartAsync(limits);
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<LimitStatusChanged>().Any(x => x.Context.Message.LimitId == "t-credit-value"), "credit desk status");
        await service.Pipeline.WhenPublishedAsync();

        var change = service.Harness.Published.Select<LimitStatusChanged>().Select(x => x.Context.Message).First(m => m.LimitId == "t-credit-value");
        Assert.Equal("breach", change.Status);
        Assert.True(change.Provisional);
        Assert.Contains(change.ProvisionalReasons!, r => r.StartsWith("book CREDIT-IG: ", StringComparison.Ordinal) && r.Contains("QFU-2029-03", StringComparison.Ordinal));
        var rates = service.Harness.Published.Select<LimitStatusChanged>().Select(x => x.Context.Message).Where(m => m.ScopeId == "RATES-CORE").ToArray();
        Assert.All(rates, m => Assert.False(m.Provisional));

        var books = service.Harness.Published.Select<BookExposuresBatch>().SelectMany(x => x.Context.Message.Books).ToArray();
        var credit = books.First(b => b.Book == "CREDIT-IG");
        Assert.True(credit.Provisional);
        Assert.Contains(credit.ProvisionalReasons!, r => r.Contains("SRT-2031-06", StringComparison.Ordinal));
        var core = books.First(b => b.Book == "RATES-CORE");
        Assert.False(core.Provisional);
        Assert.Null(core.ProvisionalReasons);

        var log = string.Concat(Directory.GetFiles(service.LogFolder, "*.jsonl").Select(File.ReadAllText));
        Assert.Contains("\"limitId\":\"t-credit-value\"", log, StringComparison.Ordinal);
        var record = log.Split('\n').First(l => l.Contains("\"limitId\":\"t-credit-value\"", StringComparison.Ordinal));
        Assert.Contains("\"provisional\":true", record, StringComparison.Ordinal);
        Assert.Contains("QFU-2029-03", record, StringComparison.Ordinal);
        Assert.True(service.VerifyLog().Intact);
    }
}
