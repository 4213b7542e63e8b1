using System.Diagnostics;
using System.Globalization;
using MassTransit;
using Monitor.Cli.Demo;
using Monitor.Cli.Hosting;
using Monitor.Contracts.V1;
using Monitor.Files;
using Monitor.Service.Hosting;
using Serilog;
using Serilog.Events;

namespace Monitor.Cli.Load;

/// <summary>
/// Runs <c>monitor load</c>: generates the <see cref="LoadScenario"/> into the working folder, then for each mode
/// (service: the real service hosted in-process on RabbitMQ; bare: a MassTransit consumer that does nothing on the
/// same broker) a paced latency phase (warm-up, then <see cref="LoadOptions.Rate"/> quotes/s for
/// <see cref="LoadOptions.Seconds"/> s) and a throughput phase (<see cref="LoadOptions.ThroughputCount"/> quotes sent
/// as fast as the broker confirms them, at most <see cref="LoadOptions.MaxInFlight"/> in flight). The publisher is a
/// separate bus in this process; all times are this process's <see cref="Stopwatch"/>.
/// </summary>
internal static class LoadRunner
{
    public const string EventsQueue = "monitor-load-events";
    public const string BareQueue = "monitor-load-bare";

    public static async Task<IReadOnlyList<PhaseResult>> RunAsync(LoadOptions options, TextWriter progress, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(progress);
        var configDir = Path.Combine(options.WorkDir, "config");
        var scenario = LoadScenario.Generate(options.Books, options.Seed);
        scenario.Write(configDir);
        var bonds = InstrumentFile.Read(Path.Combine(configDir, "instruments.csv"));
        await progress.WriteLineAsync(string.Create(CultureInfo.InvariantCulture,
            $"monitor load: {bonds.Count} government bonds, {options.Books} books x {LoadScenario.PositionsPerBook} positions; working folder {options.WorkDir}")).ConfigureAwait(false);
        var results = new List<PhaseResult>();
        if (options.Mode is LoadMode.Service or LoadMode.Both)
        {
            results.Add(await RunServiceAsync(options, configDir, bonds, progress, cancellationToken).ConfigureAwait(false));
        }
        if (options.Mode is LoadMode.Bare or LoadMode.Both)
        {
            results.Add(await RunBareAsync(options, bonds, progress, cancellationToken).ConfigureAwait(false));
        }
        return results;
    }

    private static async Task<PhaseResult> RunServiceAsync(LoadOptions options, string configDir, IReadOnlyList<Monitor.Analytics.Instruments.Bond> bonds, TextWriter progress, CancellationToken cancellationToken)
    {
        // The service reads its broker credentials from the environment (never from configuration).
        Environment.SetEnvironmentVariable(BrokerOptions.UserVariable, options.Broker.User);
        Environment.SetEnvironmentVariable(BrokerOptions.PasswordVariable, options.Broker.Password);
        var opening = new QuoteStream(bonds, 1, 0, 0, options.Seed);
        OpeningTape.Write(Path.Combine(configDir, "opening-quotes.csv"), opening, DateTimeOffset.UtcNow);
        var settings = new Dictionary<string, string?>
        {
            ["Monitor:InstrumentsFile"] = Path.Combine(configDir, "instruments.csv"),
            ["Monitor:PositionsFile"] = Path.Combine(configDir, "positions.csv"),
            ["Monitor:LimitsFile"] = Path.Combine(configDir, "limits.json"),
            ["Monitor:OpeningQuotesFile"] = Path.Combine(configDir, "opening-quotes.csv"),
            ["Monitor:ValuationDate"] = DemoScenario.ValuationDate.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
            ["Monitor:ConflationWindow"] = options.ConflationWindow.ToString("c", CultureInfo.InvariantCulture),
            ["Monitor:SnapshotInterval"] = "00:00:00",
            ["Monitor:BookEventInterval"] = (options.BookEventInterval ?? TimeSpan.FromSeconds(1)).ToString("c", CultureInfo.InvariantCulture),
            ["Transport:Kind"] = "RabbitMq",
            ["Transport:Broker:Host"] = options.Broker.Host,
            ["Transport:Broker:Port"] = options.Broker.Port.ToString(CultureInfo.InvariantCulture),
            ["Transport:Broker:VirtualHost"] = options.Broker.VirtualHost,
            ["ExposureLog:Folder"] = Path.Combine(options.WorkDir, "exposure-log"),
            ["ExposureLog:FlushToDisk"] = options.LogFlushToDisk ? "true" : "false",
        };
        var serviceLog = Path.Combine(options.WorkDir, "monitor.log");
        using var stages = new ServiceStages();
        using var host = MonitorHost.InProcess(
            settings,
            log => log.MinimumLevel.Information()
                .MinimumLevel.Override("MassTransit", LogEventLevel.Warning)
                .MinimumLevel.Override("Microsoft", LogEventLevel.Warning)
                .WriteTo.File(serviceLog, formatProvider: CultureInfo.InvariantCulture)
                .WriteTo.Console(restrictedToMinimumLevel: LogEventLevel.Fatal, standardErrorFromLevel: LogEventLevel.Verbose, formatProvider: CultureInfo.InvariantCulture),
            _ => { },
            _ => { });
        await progress.WriteLineAsync("service: starting in-process on RabbitMQ (opening fit, 1 curve)...").ConfigureAwait(false);
        await host.StartAsync(cancellationToken).ConfigureAwait(false);
        var counter = new ConsumptionCounter();
        LatencyTracker? current = null;
        counter.Consumed += (id, at) => Volatile.Read(ref current)?.OnConsumed(id, at);
        var serviceBus = (IBus)host.Services.GetService(typeof(IBus))!;
        using var observer = new ObserverHandle(serviceBus.ConnectConsumeMessageObserver(counter));
        var publisher = PublisherBus(options.Broker, cfg => cfg.ReceiveEndpoint(EventsQueue, e =>
        {
            e.Durable = false;
            e.AutoDelete = true;
            e.PurgeOnStartup = true;
            e.Consumer(() => new LoadEventConsumer(() => Volatile.Read(ref current)));
        }));
        await publisher.StartAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var quotes = await publisher.GetSendEndpoint(new Uri($"queue:{InboundEndpoints.Quotes}")).ConfigureAwait(false);
            var trades = await publisher.GetSendEndpoint(new Uri($"queue:{InboundEndpoints.Trades}")).ConfigureAwait(false);
            return await BothPhasesAsync("service", options, bonds, quotes, trades, t => Volatile.Write(ref current, t), counter, stages, progress, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            await publisher.StopAsync(CancellationToken.None).ConfigureAwait(false);
            await host.StopAsync(CancellationToken.None).ConfigureAwait(false);
        }
    }

    private static async Task<PhaseResult> RunBareAsync(LoadOptions options, IReadOnlyList<Monitor.Analytics.Instruments.Bond> bonds, TextWriter progress, CancellationToken cancellationToken)
    {
        await progress.WriteLineAsync("bare: a MassTransit consumer of BondQuoted that does nothing, same broker...").ConfigureAwait(false);
        var counter = new ConsumptionCounter();
        LatencyTracker? current = null;
        counter.Consumed += (id, at) => Volatile.Read(ref current)?.OnConsumed(id, at);
        // The same endpoint settings as the service's inbound queues: one message at a time (order kept), the same retry policy.
        var consumer = PublisherBus(options.Broker, cfg => cfg.ReceiveEndpoint(BareQueue, e =>
        {
            e.PurgeOnStartup = true;
            e.ConcurrentMessageLimit = 1;
            e.UseMessageRetry(r => r.Intervals(100, 500, 2000));
            e.Consumer<BareQuoteConsumer>();
        }));
        using var observer = new ObserverHandle(consumer.ConnectConsumeMessageObserver(counter));
        var publisher = PublisherBus(options.Broker, null);
        await consumer.StartAsync(cancellationToken).ConfigureAwait(false);
        await publisher.StartAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var quotes = await publisher.GetSendEndpoint(new Uri($"queue:{BareQueue}")).ConfigureAwait(false);
            return await BothPhasesAsync("bare", options, bonds, quotes, null, t => Volatile.Write(ref current, t), counter, null, progress, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            await publisher.StopAsync(CancellationToken.None).ConfigureAwait(false);
            await consumer.StopAsync(CancellationToken.None).ConfigureAwait(false);
        }
    }

    /// <summary>The paced phase, then the throughput phase, merged into one result.</summary>
    private static async Task<PhaseResult> BothPhasesAsync(string name, LoadOptions options, IReadOnlyList<Monitor.Analytics.Instruments.Bond> bonds, ISendEndpoint quotes, ISendEndpoint? trades,
        Action<LatencyTracker?> setCurrent, ConsumptionCounter counter, ServiceStages? stages, TextWriter progress, CancellationToken cancellationToken)
    {
        var paced = await PacedPhaseAsync(name, options, bonds, quotes, trades, setCurrent, counter, stages, progress, cancellationToken).ConfigureAwait(false);
        var throughput = await ThroughputPhaseAsync(name, options, bonds, quotes, setCurrent, counter, progress, cancellationToken).ConfigureAwait(false);
        return paced with
        {
            ThroughputSent = throughput.Sent,
            PublishRate = throughput.PublishRate,
            ThroughputConsumed = throughput.Consumed,
            ConsumeRate = throughput.ConsumeRate,
            ThroughputSeconds = throughput.Seconds,
            Faults = counter.Faults,
        };
    }

    /// <summary>Warm-up then the measured paced run; waits for the events (or consumption) to drain, at most 30 s.</summary>
    private static async Task<PhaseResult> PacedPhaseAsync(string mode, LoadOptions options, IReadOnlyList<Monitor.Analytics.Instruments.Bond> bonds,
        ISendEndpoint quotes, ISendEndpoint? trades, Action<LatencyTracker?> setTracker, ConsumptionCounter counter, ServiceStages? stages, TextWriter progress, CancellationToken cancellationToken)
    {
        var pacer = new Pacer(options.Rate);
        var warmup = pacer.CountFor(options.WarmupSeconds);
        var measured = pacer.CountFor(options.Seconds);
        var total = warmup + measured;
        var tracker = new LatencyTracker(total, warmup);
        setTracker(tracker);
        var stream = new QuoteStream(bonds, total, 0.0, 1.0, options.Seed);
        var random = new Random(options.Seed + 2);
        await progress.WriteLineAsync(string.Create(CultureInfo.InvariantCulture,
            $"{mode}: paced {options.Rate} quotes/s, {options.WarmupSeconds} s warm-up + {options.Seconds} s measured ({total} quotes)...")).ConfigureAwait(false);
        long tradesSent = 0;
        var inFlight = new List<Task>(LoadOptions.MaxInFlight + 1);
        var baseline = counter.Count;
        var clock = Stopwatch.StartNew();
        TimeSpan measuredFrom = default;
        TimeSpan cpuFrom = default;
        for (long i = 0; i < total; i++)
        {
            var delay = pacer.DelayBefore(i, clock.Elapsed);
            if (delay > TimeSpan.Zero)
            {
                await Task.Delay(delay, cancellationToken).ConfigureAwait(false);
            }
            if (i == warmup)
            {
                measuredFrom = clock.Elapsed;
                cpuFrom = Process.GetCurrentProcess().TotalProcessorTime;
                stages?.Measuring = true;
            }
            var quote = stream.Next(i, DateTimeOffset.UtcNow);
            var id = NewId.NextGuid();
            tracker.Published(id, i, Stopwatch.GetTimestamp());
            // Not awaited one by one: a send completes on the broker's publisher confirm, and waiting for each would
            // cap the rate at one confirm round trip per quote. At most MaxInFlight sends are outstanding.
            inFlight.Add(quotes.Send(quote, c => c.MessageId = id, cancellationToken));
            if (trades is not null && options.TradeEvery > 0 && i % options.TradeEvery == options.TradeEvery - 1)
            {
                inFlight.Add(trades.Send(stream.Trade(i, LoadScenario.BookId(random.Next(options.Books)), random, DateTimeOffset.UtcNow), cancellationToken));
                tradesSent++;
            }
            if (inFlight.Count >= LoadOptions.MaxInFlight)
            {
                await Task.WhenAll(inFlight).ConfigureAwait(false);
                inFlight.Clear();
            }
            else
            {
                inFlight.RemoveAll(t => t.IsCompletedSuccessfully);
            }
        }
        await Task.WhenAll(inFlight).ConfigureAwait(false);
        var seconds = (clock.Elapsed - measuredFrom).TotalSeconds;
        var cpuCores = (Process.GetCurrentProcess().TotalProcessorTime - cpuFrom).TotalSeconds / seconds;
        // Every paced quote consumed (at most 3 minutes: a service that falls behind shows it in the latencies), then the events.
        await WaitForAsync(() => counter.Count - baseline >= total, TimeSpan.FromMinutes(3), cancellationToken).ConfigureAwait(false);
        await DrainAsync(() => tracker.CurveEvents + tracker.StatusEvents + tracker.BookEvents + counter.Count, TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(30), cancellationToken).ConfigureAwait(false);
        setTracker(null);
        stages?.Measuring = false;
        tracker.Finish();
        var latencies = trades is null
            ? new[] { tracker.Consumed.Summary() }
            : [tracker.Consumed.Summary(), tracker.Curve.Summary(), tracker.AnyQuoteCurve.Summary(), tracker.Status.Summary(), tracker.BooksFirst.Summary(), tracker.BooksLast.Summary()];
        if (stages is not null)
        {
            latencies = [.. latencies, .. stages.Summaries()];
        }
        return new PhaseResult(mode, measured, seconds, measured / seconds, latencies, tracker.CurveEvents, tracker.StatusEvents, tracker.BookEvents, tradesSent, 0, 0, 0, 0, 0, 0, cpuCores);
    }

    private readonly record struct Throughput(long Sent, double PublishRate, long Consumed, double ConsumeRate, double Seconds);

    /// <summary>Sends <see cref="LoadOptions.ThroughputCount"/> pre-built quotes as fast as the broker confirms them and times their consumption.</summary>
    private static async Task<Throughput> ThroughputPhaseAsync(string mode, LoadOptions options, IReadOnlyList<Monitor.Analytics.Instruments.Bond> bonds,
        ISendEndpoint quotes, Action<LatencyTracker?> setTracker, ConsumptionCounter counter, TextWriter progress, CancellationToken cancellationToken)
    {
        var count = options.ThroughputCount;
        // Built before the clock starts: the tape stays at the end of the day (noise only).
        var stream = new QuoteStream(bonds, count, 1.0, 1.0, options.Seed + 3);
        var now = DateTimeOffset.UtcNow;
        var tape = new BondQuoted[count];
        var ids = new Guid[count];
        for (long i = 0; i < count; i++)
        {
            tape[i] = stream.Next(i, now.AddTicks(i));
            ids[i] = NewId.NextGuid();
        }
        var tracker = new LatencyTracker(count, long.MaxValue);
        setTracker(tracker);
        await progress.WriteLineAsync(string.Create(CultureInfo.InvariantCulture, $"{mode}: throughput, {count} quotes as fast as possible...")).ConfigureAwait(false);
        var baseline = counter.Count;
        var start = Stopwatch.GetTimestamp();
        var pending = new List<Task>(LoadOptions.MaxInFlight);
        for (long i = 0; i < count; i++)
        {
            var id = ids[i];
            tracker.Published(id, i, Stopwatch.GetTimestamp());
            pending.Add(quotes.Send(tape[i], c => c.MessageId = id, cancellationToken));
            if (pending.Count == LoadOptions.MaxInFlight)
            {
                await Task.WhenAll(pending).ConfigureAwait(false);
                pending.Clear();
            }
        }
        await Task.WhenAll(pending).ConfigureAwait(false);
        var published = Stopwatch.GetElapsedTime(start).TotalSeconds;
        var deadline = Stopwatch.StartNew();
        var lastCount = -1L;
        var lastProgress = Stopwatch.StartNew();
        while (counter.Count - baseline < count && deadline.Elapsed < TimeSpan.FromMinutes(5) && lastProgress.Elapsed < TimeSpan.FromSeconds(10))
        {
            await Task.Delay(50, cancellationToken).ConfigureAwait(false);
            if (counter.Count != lastCount)
            {
                lastCount = counter.Count;
                lastProgress.Restart();
            }
        }
        var consumed = counter.Count - baseline;
        var seconds = Stopwatch.GetElapsedTime(start, counter.LastTimestamp).TotalSeconds;
        // Let the service's events for the burst drain before the next phase.
        await DrainAsync(() => tracker.CurveEvents + tracker.StatusEvents + tracker.BookEvents + counter.Count, TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(30), cancellationToken).ConfigureAwait(false);
        setTracker(null);
        return new Throughput(count, count / published, consumed, consumed / seconds, seconds);
    }

    /// <summary>Waits until <paramref name="done"/> holds, at most <paramref name="most"/>.</summary>
    private static async Task WaitForAsync(Func<bool> done, TimeSpan most, CancellationToken cancellationToken)
    {
        var total = Stopwatch.StartNew();
        while (!done() && total.Elapsed < most)
        {
            await Task.Delay(50, cancellationToken).ConfigureAwait(false);
        }
    }

    /// <summary>Waits until <paramref name="activity"/> has not changed for <paramref name="quiet"/>, at most <paramref name="most"/>.</summary>
    private static async Task DrainAsync(Func<long> activity, TimeSpan quiet, TimeSpan most, CancellationToken cancellationToken)
    {
        var total = Stopwatch.StartNew();
        var still = Stopwatch.StartNew();
        var last = activity();
        while (total.Elapsed < most && still.Elapsed < quiet)
        {
            await Task.Delay(100, cancellationToken).ConfigureAwait(false);
            var now = activity();
            if (now != last)
            {
                last = now;
                still.Restart();
            }
        }
    }

    // Bus.Factory builds the bus without AddMassTransit: MassTransit's usage tracker is never looked up, so this bus
    // reports no usage telemetry (the in-process service turns it off in ServiceRegistration: Hosting/UsageReportingOff).
    private static IBusControl PublisherBus(BrokerAddress broker, Action<IRabbitMqBusFactoryConfigurator>? endpoints) =>
        Bus.Factory.CreateUsingRabbitMq(cfg =>
        {
            cfg.Host(broker.Host, (ushort)broker.Port, broker.VirtualHost, h =>
            {
                h.Username(broker.User);
                h.Password(broker.Password);
            });
            endpoints?.Invoke(cfg);
        });

    private sealed class ObserverHandle(ConnectHandle handle) : IDisposable
    {
        public void Dispose() => handle.Disconnect();
    }
}
