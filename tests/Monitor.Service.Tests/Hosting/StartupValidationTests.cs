using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Hosting;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Hosting;

/// <summary>Bad configuration stops the start-up (a real Generic Host) with a message naming the key and the fix.</summary>
public sealed class StartupValidationTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private async Task<Exception> StartFails(Action<Dictionary<string, string?>> change)
    {
        var settings = ServiceUnderTest.Settings(_folder.Combine("log"));
        change(settings);
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(settings).Build();
        var builder = Host.CreateEmptyApplicationBuilder(new HostApplicationBuilderSettings());
        builder.Services.AddMonitorService(configuration);
        using var host = builder.Build();
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        return await Assert.ThrowsAnyAsync<Exception>(() => host.StartAsync(timeout.Token));
    }

    [Fact]
    public async Task A_missing_limits_file_names_the_key()
    {
        var ex = await StartFails(s => s["Monitor:LimitsFile"] = _folder.Combine("no-such-limits.json"));
        Assert.Contains("Monitor:LimitsFile", ex.Message, StringComparison.Ordinal);
        Assert.Contains("does not exist", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_folder_in_place_of_the_limits_file_stops_the_start_naming_the_key_and_the_fix()
    {
        var folder = _folder.Combine("limits.json");
        Directory.CreateDirectory(folder); // no good limits at start: the start stops rather than run unjudged
        var ex = await StartFails(s => s["Monitor:LimitsFile"] = folder);
        Assert.Contains("Monitor:LimitsFile", ex.Message, StringComparison.Ordinal);
        Assert.Contains("is a folder, not a file", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_negative_conflation_window_names_the_key()
    {
        var ex = await StartFails(s => s["Monitor:ConflationWindow"] = "-00:00:01");
        Assert.Contains("Monitor:ConflationWindow", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task RabbitMq_without_credentials_names_the_keys()
    {
        Assert.Null(Environment.GetEnvironmentVariable(BrokerOptions.UserVariable)); // the tests never set it process-wide
        var ex = await StartFails(s => s["Transport:Kind"] = "RabbitMq");
        Assert.Contains(BrokerOptions.UserVariable, ex.Message, StringComparison.Ordinal);
        Assert.Contains("Transport:Broker:UserFile", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_limit_whose_warning_is_above_its_hard_limit_names_the_file_and_the_field()
    {
        var limits = TestMarket.WriteLimits(_folder.Path,
            "{ \"id\": \"t-bad\", \"scope\": \"book\", \"scopeId\": \"RATES-CORE\", \"measure\": \"dv01\", \"upper\": 1000, \"warning\": 1.2 }");
        var ex = await StartFails(s => s["Monitor:LimitsFile"] = limits);
        Assert.Contains("Monitor:LimitsFile", ex.Message, StringComparison.Ordinal);
        Assert.Contains("limits[0].warning", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_blank_exposure_log_folder_names_the_key()
    {
        var ex = await StartFails(s => s["ExposureLog:Folder"] = " ");
        Assert.Contains("ExposureLog:Folder", ex.Message, StringComparison.Ordinal);
    }
}
