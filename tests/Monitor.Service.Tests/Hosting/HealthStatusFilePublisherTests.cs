using System.Text.Json.Nodes;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Hosting;

/// <summary>The health report file, the service's probe in place of an HTTP endpoint.</summary>
public sealed class HealthStatusFilePublisherTests
{
    [Fact]
    public async Task A_missing_folder_of_the_status_file_is_created()
    {
        using var folder = new TempFolder();
        var file = folder.Combine(Path.Combine("var", "health", "health.json"));
        var publisher = new HealthStatusFilePublisher(
            Options.Create(new HealthOptions { StatusFile = file }), TimeProvider.System, NullLogger<HealthStatusFilePublisher>.Instance);

        await publisher.PublishAsync(Report(HealthStatus.Healthy, "storage writable"), CancellationToken.None);

        Assert.Equal("Healthy", (string?)JsonNode.Parse(File.ReadAllText(file))!["status"]);
    }

    [Fact]
    public async Task Each_report_replaces_the_file_with_the_overall_and_per_check_status()
    {
        using var folder = new TempFolder();
        var file = folder.Combine("health.json");
        var publisher = new HealthStatusFilePublisher(
            Options.Create(new HealthOptions { StatusFile = file }), TimeProvider.System, NullLogger<HealthStatusFilePublisher>.Instance);

        await publisher.PublishAsync(Report(HealthStatus.Unhealthy, "storage failing, pipeline stalled: trade-journal: No space left on device"), CancellationToken.None);
        var unhealthy = JsonNode.Parse(File.ReadAllText(file))!;
        Assert.Equal("Unhealthy", (string?)unhealthy["status"]);
        Assert.Equal("Unhealthy", (string?)unhealthy["entries"]!["storage"]!["status"]);
        Assert.Contains("No space left on device", (string?)unhealthy["entries"]!["storage"]!["description"], StringComparison.Ordinal);
        Assert.Equal("Healthy", (string?)unhealthy["entries"]!["curves"]!["status"]);

        await publisher.PublishAsync(Report(HealthStatus.Healthy, "storage writable"), CancellationToken.None);
        var healthy = JsonNode.Parse(File.ReadAllText(file))!;
        Assert.Equal("Healthy", (string?)healthy["status"]);
        Assert.Equal("storage writable", (string?)healthy["entries"]!["storage"]!["description"]);
        Assert.False(File.Exists(file + ".tmp"));
    }

    [Fact]
    public async Task The_file_carries_its_write_time_says_Stopped_at_stop_and_its_missing_folder_is_created()
    {
        using var folder = new TempFolder();
        var file = Path.Combine(folder.Path, "run", "health", "health.json"); // neither folder exists yet
        var clock = new Microsoft.Extensions.Time.Testing.FakeTimeProvider(new DateTimeOffset(2026, 6, 1, 9, 30, 0, TimeSpan.Zero));
        var publisher = new HealthStatusFilePublisher(
            Options.Create(new HealthOptions { StatusFile = file }), clock, NullLogger<HealthStatusFilePublisher>.Instance);

        await publisher.PublishAsync(Report(HealthStatus.Healthy, "storage writable"), CancellationToken.None);
        var running = JsonNode.Parse(File.ReadAllText(file))!;
        Assert.Equal(("Healthy", "2026-06-01T09:30:00.0000000+00:00"), ((string?)running["status"], (string?)running["writtenAt"]));

        clock.Advance(TimeSpan.FromMinutes(5));
        await publisher.StopAsync(CancellationToken.None);
        await publisher.PublishAsync(Report(HealthStatus.Healthy, "a report that arrives after the stop"), CancellationToken.None);

        var stopped = JsonNode.Parse(File.ReadAllText(file))!;
        Assert.Equal((HealthStatusFilePublisher.Stopped, "2026-06-01T09:35:00.0000000+00:00"), ((string?)stopped["status"], (string?)stopped["writtenAt"]));
    }

    [Fact]
    public void A_period_under_a_second_is_refused_naming_the_key()
    {
        var failures = new HealthOptions { Period = TimeSpan.FromMilliseconds(200) }.Validate();

        Assert.Contains("Health:Period", Assert.Single(failures), StringComparison.Ordinal);
    }

    private static HealthReport Report(HealthStatus storage, string description) => new(
        new Dictionary<string, HealthReportEntry>
        {
            ["storage"] = new(storage, description, TimeSpan.Zero, null, null),
            ["curves"] = new(HealthStatus.Healthy, "curves fresh", TimeSpan.Zero, null, null),
        },
        TimeSpan.Zero);
}
