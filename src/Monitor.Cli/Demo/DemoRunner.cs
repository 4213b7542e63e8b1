using System.Diagnostics;
using System.Globalization;
using MassTransit;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Monitor.Cli.Hosting;
using Monitor.Files;
using Monitor.Service.Audit;
using Monitor.Service.Storage;
using Monitor.Service.Pipeline;
using Serilog;
using Serilog.Events;
using Spectre.Console;

namespace Monitor.Cli.Demo;

/// <summary>
/// Runs the demo: copies config/demo into the working folder, writes the 08:00 quotes as the opening quotes file, starts the service in-process on the in-memory
/// transport with the <see cref="SimulatedClock"/>, plays the <see cref="DemoScenario"/> through the bus, shows it
/// (<see cref="LiveView"/> or <see cref="PlainView"/>), stops the service (stop record), verifies the exposure log
/// and prints the <see cref="DemoSummary"/>.
/// </summary>
internal static class DemoRunner
{
    private static readonly string[] ConfigFiles = ["instruments.csv", "positions.csv", "limits.json"];

    public static async Task<DemoOutcome> RunAsync(DemoOptions options, TextWriter output, IAnsiConsole? console, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(output);
        var workDir = Path.GetFullPath(options.WorkDir);
        var configDir = Path.Combine(workDir, "config");
        var logFolder = Path.Combine(workDir, "exposure-log");
        var checkpointFolder = logFolder + "-checkpoints";
        // A throw-away record key for this run, in the work folder (never inside the log folder): the log is MACed with it.
        var keyFile = Path.Combine(workDir, "record.key");
        Directory.CreateDirectory(configDir);
        File.WriteAllText(keyFile, RecordKey.NewText());
        CopyConfig(configDir);
        output.WriteLine($"monitor demo: an invented trading day at the fictional Pellowmere Capital, speed {options.Speed.ToString("G", CultureInfo.InvariantCulture)}.");
        output.WriteLine($"Working folder: {workDir} (exposure log in {logFolder}, service log in monitor.log)");

        var clock = new SimulatedClock(DemoScenario.DayStart, DemoScenario.BaseRate * options.Speed);
        var recorder = new DemoRecorder();
        var settings = new Dictionary<string, string?>
        {
            ["Monitor:InstrumentsFile"] = Path.Combine(configDir, "instruments.csv"),
            ["Monitor:PositionsFile"] = Path.Combine(configDir, "positions.csv"),
            ["Monitor:LimitsFile"] = Path.Combine(configDir, "limits.json"),
            ["Monitor:OpeningQuotesFile"] = Path.Combine(configDir, "opening-quotes.csv"),
            ["Monitor:ValuationDate"] = DemoScenario.ValuationDate.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
            ["Monitor:ConflationWindow"] = "00:00:00.020",
            // At high speed a real-time hiccup (a slow disk flush under the pipeline's lock) spans simulated hours and
            // would leave every quote "stale" after the default 4 hours; the compressed day keeps quotes for the day.
            ["Monitor:StaleQuoteAfter"] = "1.00:00:00",
            // Timers run in real time: one snapshot per simulated hour.
            ["Monitor:SnapshotInterval"] = TimeSpan.FromSeconds(3600 / clock.Rate).ToString("c", CultureInfo.InvariantCulture),
            ["Transport:Kind"] = "InMemory",
            ["ExposureLog:Folder"] = logFolder,
            ["Record:KeyFile"] = keyFile,
            ["Record:CheckpointFolder"] = checkpointFolder,
            // Timers run in real time: one checkpoint per simulated hour, like the snapshots.
            ["Record:CheckpointInterval"] = TimeSpan.FromSeconds(3600 / clock.Rate).ToString("c", CultureInfo.InvariantCulture),
        };
        var serviceLog = Path.Combine(workDir, "monitor.log");
        void Logging(LoggerConfiguration log)
        {
            log.MinimumLevel.Information()
                .MinimumLevel.Override("MassTransit", LogEventLevel.Warning)
                .MinimumLevel.Override("Microsoft", LogEventLevel.Warning)
                .WriteTo.File(serviceLog, formatProvider: CultureInfo.InvariantCulture);
            if (!options.Live)
            {
                log.WriteTo.Console(restrictedToMinimumLevel: LogEventLevel.Error, standardErrorFromLevel: LogEventLevel.Verbose, formatProvider: CultureInfo.InvariantCulture);
            }
        }

        var bonds = InstrumentFile.Read(settings["Monitor:InstrumentsFile"]!);
        var quotes = new QuoteFactory(bonds, new MarketPath(options.Seed, DemoScenario.BurstCount), new Random(options.Seed + 1));
        OpeningQuotes.Write(settings["Monitor:OpeningQuotesFile"]!, quotes);

        var started = Stopwatch.StartNew();
        using var host = MonitorHost.InProcess(
            settings,
            Logging,
            services =>
            {
                services.AddSingleton<TimeProvider>(clock);
                services.AddSingleton(recorder);
            },
            bus =>
            {
                bus.AddConsumer<LimitStatusConsumer>();
                bus.AddConsumer<CurveEventConsumer>();
            });
        await host.StartAsync(cancellationToken).ConfigureAwait(false);
        var pipeline = host.Services.GetRequiredService<RiskPipeline>();
        var driver = new ScenarioDriver(host.Services.GetRequiredService<IBus>(), clock, quotes, recorder);

        var interrupted = false;
        var driving = DriveAsync(driver, pipeline, recorder, cancellationToken);
        Task<DemoSnapshot> Capture() => DemoSnapshot.CaptureAsync(pipeline, clock, CancellationToken.None);
        if (options.Live && console is not null)
        {
            await new LiveView(console).RunAsync(Capture, recorder, driving).ConfigureAwait(false);
        }
        else
        {
            await new PlainView(output).RunAsync(Capture, recorder, driving).ConfigureAwait(false);
        }
        try
        {
            await driving.ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            interrupted = true;
        }
        var final = await Capture().ConfigureAwait(false);
        await host.StopAsync(CancellationToken.None).ConfigureAwait(false);
        started.Stop();

        var key = RecordKey.FromText(File.ReadAllText(keyFile), keyFile);
        var outcome = new DemoOutcome(workDir, logFolder, recorder.QuotesSent, recorder.TradesSent, recorder.Fits, recorder.Rejections().Count, recorder.Outliers,
            recorder.Changes(), final, ExposureLogVerifier.VerifyFolder(key, logFolder, checkpointFolder: checkpointFolder), started.Elapsed, interrupted)
        {
            KeyFile = keyFile,
            CheckpointFolder = checkpointFolder,
        };
        DemoSummary.Write(output, outcome);
        return outcome;
    }

    /// <summary>Plays the scenario, then waits until the service has worked off what it was sent (no dirty curve, no event for 300 ms; at most 10 s).</summary>
    private static async Task DriveAsync(ScenarioDriver driver, RiskPipeline pipeline, DemoRecorder recorder, CancellationToken cancellationToken)
    {
        await driver.RunAsync(cancellationToken).ConfigureAwait(false);
        var deadline = DateTimeOffset.UtcNow.AddSeconds(10);
        while (DateTimeOffset.UtcNow < deadline)
        {
            await Task.Delay(100, cancellationToken).ConfigureAwait(false);
            var dirty = await pipeline.ReadAsync(e => e.DirtyCurves().Count, cancellationToken).ConfigureAwait(false);
            if (dirty == 0 && DateTimeOffset.UtcNow - recorder.LastActivity > TimeSpan.FromMilliseconds(300))
            {
                return;
            }
        }
    }

    /// <summary>Copies the scenario's files (config/demo, shipped beside the executable) into the working folder.</summary>
    private static void CopyConfig(string configDir)
    {
        var source = Path.Combine(AppContext.BaseDirectory, "config", "demo");
        if (!Directory.Exists(source))
        {
            source = Path.Combine(Environment.CurrentDirectory, "config", "demo");
        }
        foreach (var name in ConfigFiles)
        {
            var from = Path.Combine(source, name);
            if (!File.Exists(from))
            {
                throw new FileNotFoundException($"The demo scenario file '{from}' is missing; build src/Monitor.Cli (it copies config/demo beside the executable) or run from the repository root.", from);
            }
            File.Copy(from, Path.Combine(configDir, name), overwrite: true);
        }
    }
}
