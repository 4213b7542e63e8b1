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

    [Theory]
    [InlineData("Monitor:BusinessDay:RollTime", "5pm")]
    [InlineData("Monitor:BusinessDay:TimeZone", "Mars/Olympus")]
    [InlineData("Monitor:BusinessDay:TimeZone", "Eastern Standard Time")]
    public async Task A_bad_business_day_roll_names_the_key(string key, string value)
    {
        var ex = await StartFails(s => s[key] = value);
        Assert.Contains(key, ex.Message, StringComparison.Ordinal);
        Assert.Contains(value, ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_retired_business_day_offset_is_refused_with_its_replacement()
    {
        var ex = await StartFails(s => s["ExposureLog:BusinessDayUtcOffset"] = "-05:00:00");
        Assert.Contains("Monitor:BusinessDay:TimeZone", ex.Message, StringComparison.Ordinal);
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
    public async Task A_bond_in_another_currency_in_the_instruments_file_stops_the_start_with_file_line_and_value()
    {
        var instruments = _folder.Combine("instruments.csv");
        File.WriteAllText(instruments, File.ReadAllText(TestMarket.Data("instruments.csv")).Replace("VGB-2027-11,Republic of Veloria,,XTS", "VGB-2027-11,Republic of Veloria,,EUR", StringComparison.Ordinal));
        var line = Array.FindIndex(File.ReadAllLines(instruments), l => l.StartsWith("VGB-2027-11,", StringComparison.Ordinal)) + 1;

        var ex = await StartFails(s => s["Monitor:InstrumentsFile"] = instruments);

        Assert.Contains("Monitor:InstrumentsFile", ex.Message, StringComparison.Ordinal);
        Assert.Contains($"instruments.csv, line {line}, column 'currency'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("currency", ex.Message, StringComparison.Ordinal);
        Assert.Contains("'EUR'", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_reporting_currency_that_is_not_a_code_names_the_key()
    {
        var ex = await StartFails(s => s["Monitor:ReportingCurrency"] = "euro");
        Assert.Contains("Monitor:ReportingCurrency", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_blank_exposure_log_folder_names_the_key()
    {
        var ex = await StartFails(s => s["ExposureLog:Folder"] = " ");
        Assert.Contains("ExposureLog:Folder", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_missing_record_key_stops_the_start_and_names_the_fix()
    {
        // Without a key the log and the journal could not be MACed: the start is refused (exit 2 in monitor run).
        var ex = await StartFails(s => s["Record:KeyFile"] = _folder.Combine("no-such-key"));
        Assert.Contains("Record:KeyFile", ex.Message, StringComparison.Ordinal);
        Assert.Contains("no-such-key", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void No_key_file_and_no_variable_names_both_ways_to_give_the_key()
    {
        var validator = Validator(_ => null);
        var result = validator.Validate(null, new Monitor.Service.Storage.RecordOptions());
        Assert.True(result.Failed);
        Assert.Contains("MONITOR_RECORD_KEY", result.FailureMessage, StringComparison.Ordinal);
        Assert.Contains("Record:KeyFile", result.FailureMessage, StringComparison.Ordinal);
    }

    [Fact]
    public void A_key_file_inside_the_log_or_journal_folder_is_refused()
    {
        var log = _folder.Combine("log");
        var key = TestKey.FileIn(log);
        var result = Validator(_ => null).Validate(null, new Monitor.Service.Storage.RecordOptions { KeyFile = key });
        Assert.True(result.Failed);
        Assert.Contains("lies inside ExposureLog:Folder", result.FailureMessage, StringComparison.Ordinal);
        var inJournal = TestKey.FileIn(log + "-journal");
        Assert.Contains("lies inside Journal:Folder", Validator(_ => null).Validate(null, new Monitor.Service.Storage.RecordOptions { KeyFile = inJournal }).FailureMessage, StringComparison.Ordinal);
    }

    [Fact]
    public void A_checkpoint_folder_inside_the_log_folder_is_refused()
    {
        var options = new Monitor.Service.Storage.RecordOptions { CheckpointFolder = Path.Combine(_folder.Combine("log"), "checkpoints") };
        var result = Validator(_ => TestKey.Text).Validate(null, options);
        Assert.True(result.Failed);
        Assert.Contains("Record:CheckpointFolder", result.FailureMessage, StringComparison.Ordinal);
        Assert.True(Validator(_ => TestKey.Text).Validate(null, new Monitor.Service.Storage.RecordOptions()).Succeeded);
    }

    private RecordOptionsValidator Validator(Func<string, string?> environment) => new(
        Microsoft.Extensions.Options.Options.Create(new Monitor.Service.Audit.ExposureLogOptions { Folder = _folder.Combine("log") }),
        Microsoft.Extensions.Options.Options.Create(new Monitor.Service.Journal.JournalOptions { Folder = _folder.Combine("log") + "-journal" }),
        environment);
}
