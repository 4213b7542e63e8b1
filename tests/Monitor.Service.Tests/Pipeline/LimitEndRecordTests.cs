using System.Security.Cryptography;
using System.Text;
using MassTransit.Testing;
using Monitor.Contracts.V1;
using Monitor.Limits;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// Issue 10: a limits reload recorded ids only, removing a limit in breach ended the breach without an event, and a
/// temporary limit never expired. Now a reload's record carries the file's SHA-256 and the old and new definitions, a
/// removed limit ends as "retired" and an expired one as "expired" (each with its event and record), and a reload that
/// ends a breach raises <see cref="LimitsReloadFlagged"/>. A limit of 1 money per bp on a long book is in breach from
/// the opening fit (DV01 of tens of thousands; utilisation = DV01 / 1).
/// </summary>
public sealed class LimitEndRecordTests : IDisposable
{
    private const string Tiny = """{ "id": "t-tiny", "scope": "book", "scopeId": "RATES-CORE", "measure": "dv01", "upper": 1 }""";

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task Removing_a_limit_in_breach_retires_it_on_record_and_raises_the_alert()
    {
        await using var service = await ServiceUnderTest.StartAsync(TestMarket.WriteLimits(_folder.Path, Tiny));
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<LimitStatusChanged>().Any(x => x.Context.Message.LimitId == "t-tiny"), "t-tiny breach");
        Assert.Equal(LimitStatus.Breach, await service.Pipeline.ReadAsync(e => e.Limits.StatusOf("t-tiny")));

        var bytes = await File.ReadAllBytesAsync(TestMarket.Data("limits.json")); // the same file without t-tiny
        var sha256 = Convert.ToHexStringLower(SHA256.HashData(bytes));
        await service.Pipeline.ReloadLimitsAsync(LimitsFileParser.Parse(Encoding.UTF8.GetString(bytes)), "limits.json", sha256, CancellationToken.None);
        await service.Pipeline.WhenPublishedAsync();

        var retired = service.Harness.Published.Select<LimitStatusChanged>().Select(x => x.Context.Message).Last(m => m.LimitId == "t-tiny");
        Assert.Equal(("retired", "breach"), (retired.Status, retired.PreviousStatus));
        Assert.Equal(1, retired.Limit);
        var alert = Assert.Single(service.Harness.Published.Select<LimitsReloadFlagged>()).Context.Message;
        Assert.Equal((sha256, 4), (alert.Sha256, alert.LimitCount));
        Assert.Equal(["t-tiny"], alert.RemovedLimitIds);
        Assert.Contains(alert.Reasons, r => r.Contains("'t-tiny'", StringComparison.Ordinal) && r.Contains("breach", StringComparison.Ordinal));

        var reload = Assert.Single(ExposureLogRecords.Of(service.LogFolder, "limits-reloaded"))["payload"]!;
        Assert.Equal(sha256, (string?)reload["sha256"]);
        var removed = Assert.Single(reload["removed"]!.AsArray())!;
        Assert.Equal(("t-tiny", "book", "RATES-CORE", "dv01", 1.0), ((string?)removed["id"], (string?)removed["scope"], (string?)removed["scopeId"], (string?)removed["measure"], (double?)removed["upper"]));
        Assert.NotEmpty(reload["flagged"]!.AsArray());
        Assert.Contains(ExposureLogRecords.Of(service.LogFolder, "status-change"),
            r => (string?)r["payload"]!["limitId"] == "t-tiny" && (string?)r["payload"]!["status"] == "retired" && (string?)r["payload"]!["previous"] == "breach");
        Assert.True(service.VerifyLog().Intact);
    }

    [Fact]
    public async Task A_modified_limit_is_recorded_with_its_old_and_new_definition()
    {
        await using var service = await ServiceUnderTest.StartAsync(TestMarket.WriteLimits(_folder.Path, Tiny));
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<LimitStatusChanged>().Any(x => x.Context.Message.LimitId == "t-tiny"), "t-tiny breach");
        var loosened = File.ReadAllText(TestMarket.WriteLimits(_folder.Path, Tiny.Replace("\"upper\": 1", "\"upper\": 1000000", StringComparison.Ordinal)));

        await service.Pipeline.ReloadLimitsAsync(LimitsFileParser.Parse(loosened), "limits.json", "00", CancellationToken.None);
        await service.Pipeline.WhenPublishedAsync();

        var modified = Assert.Single(Assert.Single(ExposureLogRecords.Of(service.LogFolder, "limits-reloaded"))["payload"]!["modified"]!.AsArray())!;
        Assert.Equal((1.0, 1000000.0), ((double?)modified["before"]!["upper"], (double?)modified["after"]!["upper"]));
        Assert.Empty(service.Harness.Published.Select<LimitsReloadFlagged>()); // loosened, not removed: no alert
    }

    [Fact]
    public async Task A_temporary_limit_expires_on_the_business_clock_with_an_event_and_a_record()
    {
        var expiresAt = TestMarket.Now.AddMinutes(10).ToString("O", System.Globalization.CultureInfo.InvariantCulture);
        var temporary = Tiny.Replace("t-tiny", "t-temp", StringComparison.Ordinal).Replace(" }", $", \"expiresAt\": \"{expiresAt}\" }}", StringComparison.Ordinal);
        await using var service = await ServiceUnderTest.StartAsync(TestMarket.WriteLimits(_folder.Path, temporary));
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<LimitStatusChanged>().Any(x => x.Context.Message.LimitId == "t-temp"), "t-temp breach");

        service.Time.Advance(TimeSpan.FromMinutes(11)); // the service's clock passes expiresAt; its expiry timer runs

        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<LimitStatusChanged>().Any(x => x.Context.Message.LimitId == "t-temp" && x.Context.Message.Status == "expired"), "t-temp expired");
        var expired = service.Harness.Published.Select<LimitStatusChanged>().Select(x => x.Context.Message).Last(m => m.LimitId == "t-temp");
        Assert.Equal("breach", expired.PreviousStatus);
        Assert.Contains(ExposureLogRecords.Of(service.LogFolder, "status-change"),
            r => (string?)r["payload"]!["limitId"] == "t-temp" && (string?)r["payload"]!["status"] == "expired");
        Assert.DoesNotContain("t-temp", await service.Pipeline.ReadAsync(e => e.Limits.Limits.Select(l => l.Id).ToArray()));
    }
}
