using MassTransit;
using MassTransit.Testing;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Time.Testing;
using Monitor.Analytics.Market;
using Monitor.Contracts.V1;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Pipeline;

namespace Monitor.Service.Tests.Support;

/// <summary>
/// The whole service (AddMonitorService's wiring) on MassTransit's test harness and in-memory transport, over an
/// in-memory configuration that points at Data/ and a temp exposure-log folder. Time is a FakeTimeProvider at
/// <see cref="TestMarket.Now"/>: the refit loop's conflation window only elapses when <see cref="RefitAsync"/>
/// advances it, so a burst of quotes lands in one refit deterministically.
/// </summary>
public sealed class ServiceUnderTest : IAsyncDisposable
{
    public static readonly TimeSpan Window = TimeSpan.FromMilliseconds(50);

    private readonly ServiceProvider _provider;
    private readonly TempFolder? _folder;

    private ServiceUnderTest(ServiceProvider provider, TempFolder? folder, FakeTimeProvider time, string logFolder)
    {
        _provider = provider;
        _folder = folder;
        Time = time;
        LogFolder = logFolder;
        // The pipeline first: the container disposes in reverse order, and the harness stops the hosted services
        // (the stop record needs the pipeline) when it is disposed.
        Pipeline = provider.GetRequiredService<RiskPipeline>();
        Harness = provider.GetRequiredService<ITestHarness>();
    }

    public ITestHarness Harness { get; }

    public IServiceProvider Services => _provider;

    public RiskPipeline Pipeline { get; }

    public FakeTimeProvider Time { get; }

    public string LogFolder { get; }

    public static Dictionary<string, string?> Settings(string logFolder, string? limitsFile = null) => new()
    {
        ["Monitor:InstrumentsFile"] = TestMarket.Data("instruments.csv"),
        ["Monitor:PositionsFile"] = TestMarket.Data("positions.csv"),
        ["Monitor:LimitsFile"] = limitsFile ?? TestMarket.Data("limits.json"),
        ["Monitor:OpeningQuotesFile"] = TestMarket.Data("quotes-open.csv"),
        ["Monitor:ValuationDate"] = "2026-06-02",
        ["Monitor:StaleQuoteAfter"] = "12:00:00",
        ["Monitor:ConflationWindow"] = Window.ToString("c", System.Globalization.CultureInfo.InvariantCulture),
        ["Monitor:SnapshotInterval"] = "00:00:00",
        ["Monitor:BookEventInterval"] = "00:00:00",
        ["ExposureLog:Folder"] = logFolder,
        ["ExposureLog:FlushToDisk"] = "false",
        // The record key in a file beside (never inside) the log folder.
        ["Record:KeyFile"] = TestKey.FileIn(Path.GetDirectoryName(Path.GetFullPath(logFolder))!),
    };

    /// <param name="limitsFile">A limits file other than Data/limits.json.</param>
    /// <param name="logStream">Wraps each exposure-log day file's stream (to inject write failures).</param>
    /// <param name="root">A folder the caller keeps (to restart a service on the same log and journal); default a new temporary one.</param>
    /// <param name="now">The clock at start; default <see cref="TestMarket.Now"/>.</param>
    /// <param name="settings">Configuration keys to add or replace (a null value removes the key), e.g. <c>Journal:AcceptLoss</c>.</param>
    /// <param name="services">Registrations added after the service's own (e.g. an IDayCloseListener).</param>
    /// <param name="logging">Replaces the default logging (e.g. a Serilog logger with a capturing sink).</param>
    public static async Task<ServiceUnderTest> StartAsync(string? limitsFile = null, Func<Stream, Stream>? logStream = null, string? root = null,
        DateTimeOffset? now = null, IReadOnlyDictionary<string, string?>? settings = null, Action<IServiceCollection>? services = null,
        Action<IServiceCollection>? logging = null)
    {
        var folder = root is null ? new TempFolder() : null;
        var logFolder = Path.Combine(root ?? folder!.Path, "exposure-log");
        var values = Settings(logFolder, limitsFile);
        foreach (var (key, value) in settings ?? new Dictionary<string, string?>())
        {
            if (value is null)
            {
                values.Remove(key);
            }
            else
            {
                values[key] = value;
            }
        }
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(values).Build();
        var time = new FakeTimeProvider(now ?? TestMarket.Now);
        var collection = new ServiceCollection();
        if (logging is null)
        {
            collection.AddLogging();
        }
        else
        {
            logging(collection);
        }
        collection.AddSingleton<TimeProvider>(time);
        collection.AddMonitorServiceCore(configuration, null, static (s, bus) => s.AddMassTransitTestHarness(bus));
        services?.Invoke(collection);
        if (logStream is not null)
        {
            collection.AddSingleton(sp => new ExposureLogWriter(sp.GetRequiredService<Monitor.Service.Storage.RecordKey>(), sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value,
                sp.GetRequiredService<TimeProvider>(), logStream, sp.GetRequiredService<Monitor.Service.Engine.BusinessDayRoll>()));
        }
        // TestTimeout: past it the harness cancels its token and the stop (stop record) fails; tests that wait on the
        // limits file's polling watcher run longer than the 30 s default on a loaded machine.
        collection.Configure<TestHarnessOptions>(o => (o.TestInactivityTimeout, o.TestTimeout) = (TimeSpan.FromSeconds(2), TimeSpan.FromMinutes(2)));
        var provider = collection.BuildServiceProvider(validateScopes: true);
        var service = new ServiceUnderTest(provider, folder, time, logFolder);
        await service.Harness.Start();
        return service;
    }

    /// <summary>Publishes quotes (envelope JSON), waits until all are consumed, then lets the refit loop run once.</summary>
    public async Task QuoteAsync(IEnumerable<BondQuote> quotes)
    {
        var before = Harness.Consumed.Select<BondQuoted>().Count();
        var count = 0;
        foreach (var q in quotes)
        {
            await Harness.Bus.Publish(ToMessage(q));
            count++;
        }
        await WaitUntilAsync(() => Harness.Consumed.Select<BondQuoted>().Count() >= before + count, "quotes consumed");
        await RefitAsync();
    }

    /// <summary>Advances the fake clock by the conflation window until the refit loop has fitted every waiting curve and its events are out.</summary>
    public async Task RefitAsync()
    {
        await WaitUntilAsync(async () =>
        {
            if (await Pipeline.WaitingRefitsAsync() == 0)
            {
                return true;
            }
            Time.Advance(Window);
            return false;
        }, "refit done");
        await Pipeline.WhenPublishedAsync();
    }

    public async Task<TradeOutcome> TradeAsync(TradeBooked trade)
    {
        var before = Harness.Consumed.Select<TradeBooked>().Count();
        await Harness.Bus.Publish(trade);
        await WaitUntilAsync(() => Harness.Consumed.Select<TradeBooked>().Count() > before, "trade consumed");
        await Pipeline.WhenPublishedAsync();
        return TradeOutcome.Applied;
    }

    public Task<EngineState> StateAsync() => Pipeline.ReadAsync(EngineState.Of);

    public ExposureLogVerification VerifyLog() => ExposureLogVerifier.VerifyFolder(TestKey.Value, LogFolder);

    /// <summary>Every line of every exposure-log day file in <paramref name="logFolder"/>, oldest day first.</summary>
    public static IReadOnlyList<string> LogLines(string logFolder) =>
        Directory.Exists(logFolder)
            ? [.. Directory.GetFiles(logFolder, "exposures-*.jsonl").Order(StringComparer.Ordinal).SelectMany(File.ReadAllLines)]
            : [];

    /// <summary>The log lines of one record kind.</summary>
    public static IReadOnlyList<string> LogLines(string logFolder, string kind) =>
        [.. LogLines(logFolder).Where(l => l.Contains($"\"kind\":\"{kind}\"", StringComparison.Ordinal))];

    public static BondQuoted ToMessage(BondQuote q) => new()
    {
        QuoteId = Guid.NewGuid().ToString("N"),
        InstrumentId = q.InstrumentId,
        BidCleanPrice = q.Bid,
        AskCleanPrice = q.Ask,
        MidCleanPrice = q.Mid,
        Yield = q.Yield,
        QuoteTime = q.QuoteTime,
        Source = q.Source ?? "test",
    };

    public static TradeBooked Trade(string id, int version, string action, string book, string instrument, double face, DateTimeOffset? tradeTime = null) => new()
    {
        TradeId = id,
        Version = version,
        Action = action,
        Book = book,
        InstrumentId = instrument,
        FaceAmount = face,
        CleanPrice = 100,
        TradeTime = tradeTime ?? TestMarket.Now.AddMinutes(-1),
    };

    /// <summary>Polls a condition every 10 ms, failing after 30 s so a broken pipeline cannot hang the run.</summary>
    public static Task WaitUntilAsync(Func<bool> condition, string what) => WaitUntilAsync(() => Task.FromResult(condition()), what);

    public static async Task WaitUntilAsync(Func<Task<bool>> condition, string what)
    {
        var deadline = DateTime.UtcNow + TimeSpan.FromSeconds(30);
        while (!await condition())
        {
            if (DateTime.UtcNow > deadline)
            {
                throw new TimeoutException($"waited 30 s for: {what}");
            }
            await Task.Delay(10);
        }
    }

    public async ValueTask DisposeAsync()
    {
        try
        {
            await _provider.DisposeAsync();
        }
        finally
        {
            _folder?.Dispose();
        }
    }
}
