using System.Net.Mime;
using MassTransit;
using MassTransit.Testing;
using Microsoft.Extensions.DependencyInjection;
using Monitor.Analytics.Market;
using Monitor.Contracts.V1;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// The service on MassTransit's test harness (in-memory transport): quotes -> CurveFitted -> BookExposuresBatch ->
/// LimitStatusChanged, conflation, hysteresis, the quality gate, plain JSON and bad messages. Status rule: warning at
/// 80%, breach at 100%, 5% band (src/Monitor.Limits/README.md; common practice, no source).
/// </summary>
public sealed class PipelineScenarioTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static IReadOnlyList<BondQuote> Government(IReadOnlyList<BondQuote> quotes) =>
        quotes.Where(q => q.InstrumentId.StartsWith("VGB", StringComparison.Ordinal)).ToArray();

    [Fact]
    public async Task Opening_fit_publishes_the_curve_and_the_book_figures()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        Assert.True(await service.Harness.Published.Any<CurveFitted>(x => x.Context.Message.CurveId == CurveKeyLabel.Government && x.Context.Message.Version == 1));
        Assert.True(await service.Harness.Published.Any<BookExposuresBatch>(x => x.Context.Message.Books.Any(b => b.Book == "RATES-CORE" && b.Measures["dv01"] > 0)));
        // UTIL-A has three bonds, below the spread minimum of four: no fit is tried, so nothing is rejected (issue 11).
        Assert.False(await service.Harness.Published.Any<CurveRejected>(x => x.Context.Message.CurveId == "UTIL-A"));
    }

    [Fact]
    public async Task Quotes_and_trades_drive_warning_breach_and_clear_and_the_log_verifies()
    {
        // A hedged steepener (RATES-CURVE plus a short in the 2027s) whose DV01 grows as the long end rallies. The
        // limit is placed from the same steps computed on a plain engine: within at the open, warning after the
        // first rally, breach after the second; selling long bonds clears it.
        var hedge = ServiceUnderTest.Trade("H-1", 1, "new", "RATES-CURVE", "VGB-2027-11", -100_000_000);
        var rally1 = TestMarket.Between(-1, TestMarket.Now.AddMinutes(-20));
        var rally2 = TestMarket.Between(-2, TestMarket.Now.AddMinutes(-10));
        var probe = TestMarket.OpenedEngine();
        probe.ApplyTrade(InboundTrade(hedge), TestMarket.Now);
        var e0 = Dv01(probe);
        Accept(probe, rally1);
        var e1 = Dv01(probe);
        Accept(probe, rally2);
        var e2 = Dv01(probe);
        var limit = Math.Min(e2, e1 / 0.8) * 0.99;
        Assert.True(e0 / limit < 0.75 && e1 / limit is >= 0.8 and < 1 && e2 / limit >= 1, $"scenario set-up: DV01 {e0}, {e1}, {e2} against {limit}");
        var limits = TestMarket.WriteLimits(_folder.Path,
            $"{{ \"id\": \"t-curve-dv01\", \"scope\": \"book\", \"scopeId\": \"RATES-CURVE\", \"measure\": \"dv01\", \"upper\": {TestMarket.Inv(limit)} }}");

        await using var service = await ServiceUnderTest.StartAsync(limits);
        await service.TradeAsync(hedge);
        await service.QuoteAsync(rally1);
        await service.QuoteAsync(rally2);
        await service.TradeAsync(ServiceUnderTest.Trade("R-1", 1, "new", "RATES-CURVE", "VGB-2051-11", -8_000_000));

        Assert.True(await service.Harness.Published.Any<CurveFitted>(x => x.Context.Message.CurveId == CurveKeyLabel.Government && x.Context.Message.Version == 3));
        Assert.True(await service.Harness.Published.Any<BookExposuresBatch>(x => x.Context.Message.Books.Any(b => b.Book == "RATES-CURVE" && b.CauseMessageType == nameof(BondQuoted))));
        var changes = service.Harness.Published.Select<LimitStatusChanged>().Select(x => x.Context.Message).Where(m => m.LimitId == "t-curve-dv01").ToArray();
        // The unhedged book breaches at the opening fit; the hedge clears it; then the rallies and the sale.
        Assert.Equal(["breach", "within", "warning", "breach", "within"], changes.Select(c => c.Status));
        Assert.Equal(["within", "breach", "within", "warning", "breach"], changes.Select(c => c.PreviousStatus));
        Assert.Equal(["opening-quotes", nameof(TradeBooked), nameof(BondQuoted), nameof(BondQuoted), nameof(TradeBooked)], changes.Select(c => c.CauseMessageType));
        Assert.All(changes, c => Assert.Equal(limit, c.Limit, 1e-6));
        Assert.Equal(e1 / limit, changes[2].Utilisation, 1e-6);
        Assert.Contains(changes[3].Curves, v => v.CurveId == CurveKeyLabel.Government && v.Version == 3);

        var log = service.VerifyLog();
        Assert.True(log.Intact, string.Join("; ", log.Problems));
        Assert.True(log.Records > 5);
    }

    [Fact]
    public async Task A_burst_of_quotes_is_conflated_into_one_refit()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var opening = Government(TestMarket.OpenQuotes());
        const int burst = 60;
        var quotes = Enumerable.Range(0, burst).Select(i =>
        {
            var q = opening[i % opening.Count];
            return new BondQuote(q.InstrumentId, TestMarket.Now.AddMinutes(-30).AddSeconds(i), null, null, q.CleanMid!.Value + 0.001 * i, null, "burst");
        });
        await service.QuoteAsync(quotes);

        var fits = service.Harness.Published.Select<CurveFitted>().Count(x => x.Context.Message.CurveId == CurveKeyLabel.Government);
        // One opening fit, then one refit for the whole burst of 60 quotes.
        Assert.Equal(2, fits);
        Assert.Equal(burst, service.Harness.Consumed.Select<BondQuoted>().Count());
    }

    [Fact]
    public async Task Quotes_oscillating_around_a_threshold_publish_at_most_one_change()
    {
        // Two quote states 0.02 apart in price; the warning threshold sits halfway between the book's DV01 in each.
        var probe = TestMarket.OpenedEngine();
        var a = probe.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];
        Accept(probe, TestMarket.Shifted(Government(TestMarket.OpenQuotes()), 0.02, TestMarket.Now.AddHours(-1)));
        var b = probe.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];
        Assert.NotEqual(a, b);
        var limit = (a + b) / 2 / 0.8;
        var limits = TestMarket.WriteLimits(_folder.Path,
            $"{{ \"id\": \"t-core-dv01\", \"scope\": \"book\", \"scopeId\": \"RATES-CORE\", \"measure\": \"dv01\", \"upper\": {TestMarket.Inv(limit)} }}");

        await using var service = await ServiceUnderTest.StartAsync(limits);
        for (var i = 0; i < 6; i++)
        {
            var shift = i % 2 == 0 ? 0.02 : 0.0;
            await service.QuoteAsync(TestMarket.Shifted(Government(TestMarket.OpenQuotes()), shift, TestMarket.Now.AddMinutes(-60 + i)));
        }

        Assert.Equal(7, service.Harness.Published.Select<CurveFitted>().Count(x => x.Context.Message.CurveId == CurveKeyLabel.Government));
        var changes = service.Harness.Published.Select<LimitStatusChanged>().Count(x => x.Context.Message.LimitId == "t-core-dv01");
        Assert.Equal(1, changes);
    }

    [Fact]
    public async Task A_corrupted_quote_set_is_rejected_and_the_last_good_curve_kept()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var before = await service.StateAsync();
        var booksBefore = service.Harness.Published.Select<BookExposuresBatch>().Sum(x => x.Context.Message.Books.Count);
        var time = TestMarket.Now.AddMinutes(-5);
        var corrupted = Government(TestMarket.OpenQuotes()).Select((q, i) =>
            new BondQuote(q.InstrumentId, time, null, null, q.CleanMid!.Value - (i % 2 == 0 ? 8 : 0), null, "bad-feed"));
        await service.QuoteAsync(corrupted);

        Assert.True(await service.Harness.Published.Any<CurveRejected>(x =>
            x.Context.Message.CurveId == CurveKeyLabel.Government && x.Context.Message.KeptCurveVersion == 1 && x.Context.Message.Reasons.Count > 0));
        var curve = await service.Pipeline.ReadAsync(e => (e.Curves[""].Version, e.Curves[""].LastFitRejected));
        Assert.Equal((1, true), curve);
        Assert.Equal(booksBefore, service.Harness.Published.Select<BookExposuresBatch>().Sum(x => x.Context.Message.Books.Count));
        Assert.Equal(before.Books, (await service.StateAsync()).Books);
    }

    [Fact]
    public async Task Par_yields_fit_their_own_reference_curve_and_move_no_figures()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var points = Monitor.Files.ParYieldFile.Read(TestMarket.Data("par-yields.csv")).Single().Points
            .Select(p => new Monitor.Contracts.V1.ParYieldPoint { Tenor = Monitor.Analytics.Fitting.ParYieldCurveFitter.TenorLabel(p.TenorYears), ParYield = p.ParYield!.Value })
            .ToArray();
        await service.Harness.Bus.Publish(new ParYieldsPublished { CurveId = "government", AsOf = TestMarket.Now, Points = points, Source = "test" });

        Assert.True(await service.Harness.Consumed.Any<ParYieldsPublished>());
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(x => x.Context.Message.CurveId == CurveKeyLabel.GovernmentPar), "par-yield fit");
        await service.Pipeline.WhenPublishedAsync();
        var par = service.Harness.Published.Select<CurveFitted>().Select(x => x.Context.Message).Single(m => m.CurveId == CurveKeyLabel.GovernmentPar);
        Assert.Equal(1, par.Version);
        Assert.Null(par.BaseCurveId);
        // The valuation curve stays the bond-fitted one: no second government version, no book figures from par yields.
        Assert.DoesNotContain(service.Harness.Published.Select<CurveFitted>(), x => x.Context.Message.CurveId == CurveKeyLabel.Government && x.Context.Message.Version > 1);
        Assert.DoesNotContain(service.Harness.Published.Select<BookExposuresBatch>(), x => x.Context.Message.Books.Any(b => b.CauseMessageType == nameof(ParYieldsPublished)));
    }

    [Fact]
    public async Task Plain_json_without_the_envelope_is_accepted()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var endpoint = await service.Harness.Bus.GetSendEndpoint(new Uri("queue:" + InboundEndpoints.Trades));
        await endpoint.Send(ServiceUnderTest.Trade("J-1", 1, "new", "RATES-CORE", "VGB-2034-11", 2_000_000), ctx =>
            ctx.Serializer = ctx.Serialization.GetMessageSerializer(new ContentType("application/json")));

        Assert.True(await service.Harness.Consumed.Any<TradeBooked>(x => x.Context.ReceiveContext.ContentType?.MediaType == "application/json"));
        await ServiceUnderTest.WaitUntilAsync(async () => await service.Pipeline.ReadAsync(e => e.Books["RATES-CORE"].Positions.GetValueOrDefault("VGB-2034-11")) == 2_000_000, "trade applied");
    }

    [Fact]
    public async Task A_refit_measures_each_stage_of_its_path()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var factory = service.Services.GetRequiredService<System.Diagnostics.Metrics.IMeterFactory>();
        string[] stages = ["monitor.refit.duration", "monitor.exposure.duration", "monitor.exposure_log.write.duration", "monitor.events.delay"];
        var measured = new System.Collections.Concurrent.ConcurrentDictionary<string, System.Collections.Concurrent.ConcurrentBag<double>>();
        using var listener = new System.Diagnostics.Metrics.MeterListener
        {
            InstrumentPublished = (instrument, l) =>
            {
                if (ReferenceEquals(instrument.Meter.Scope, factory) && stages.Contains(instrument.Name))
                {
                    l.EnableMeasurementEvents(instrument);
                }
            },
        };
        listener.SetMeasurementEventCallback<double>((instrument, value, _, _) => measured.GetOrAdd(instrument.Name, _ => []).Add(value));
        listener.Start();

        await service.QuoteAsync(Government(TestMarket.Between(-1, TestMarket.Now.AddMinutes(-5))));
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(x => x.Context.Message.Version == 2), "refit");
        await service.Pipeline.WhenPublishedAsync();

        Assert.All(stages, stage => Assert.True(measured.TryGetValue(stage, out var values) && values.All(v => double.IsFinite(v) && v >= 0), stage));
        // The refit holds the lock through the books and the log write: no refit took less than either of its parts.
        Assert.True(measured["monitor.refit.duration"].Max() >= measured["monitor.exposure_log.write.duration"].Min());
        Assert.True(measured["monitor.refit.duration"].Max() >= measured["monitor.exposure.duration"].Min());
    }

    [Fact]
    public async Task A_trade_for_an_unknown_book_faults_with_the_field_named_and_changes_nothing()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var before = await service.StateAsync();
        var factory = service.Services.GetRequiredService<System.Diagnostics.Metrics.IMeterFactory>();
        var rejectedByField = new System.Collections.Concurrent.ConcurrentDictionary<string, long>();
        using var listener = new System.Diagnostics.Metrics.MeterListener
        {
            InstrumentPublished = (instrument, l) =>
            {
                if (ReferenceEquals(instrument.Meter.Scope, factory) && instrument.Name == "monitor.messages.rejected")
                {
                    l.EnableMeasurementEvents(instrument);
                }
            },
        };
        listener.SetMeasurementEventCallback<long>((_, value, tags, _) =>
        {
            foreach (var tag in tags)
            {
                if (tag.Key == "field")
                {
                    rejectedByField.AddOrUpdate((string)tag.Value!, value, (_, v) => v + value);
                }
            }
        });
        listener.Start();
        await service.Harness.Bus.Publish(ServiceUnderTest.Trade("B-1", 1, "new", "NO-SUCH-BOOK", "VGB-2034-11", 1_000_000));

        Assert.True(await service.Harness.Published.Any<Fault<TradeBooked>>());
        var fault = service.Harness.Published.Select<Fault<TradeBooked>>().First().Context.Message;
        Assert.Contains("book: 'NO-SUCH-BOOK'", fault.Exceptions[0].Message, StringComparison.Ordinal);
        Assert.Equal(typeof(Monitor.Service.Messaging.MessageRejectedException).FullName, fault.Exceptions[0].ExceptionType);
        Assert.Equal(before, await service.StateAsync());
        Assert.Equal(1, rejectedByField.GetValueOrDefault("book"));
    }

    [Fact]
    public async Task A_trade_whose_log_write_fails_changes_nothing_and_is_applied_once_on_retry()
    {
        var fail = new System.Runtime.CompilerServices.StrongBox<bool>();
        await using var service = await ServiceUnderTest.StartAsync(logStream: s => new FaultyStream(s, () => Volatile.Read(ref fail.Value)));
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        var writer = service.Services.GetRequiredService<Monitor.Service.Audit.ExposureLogWriter>();
        Task<double> Position() => service.Pipeline.ReadAsync(e => e.Books["RATES-CORE"].Positions.GetValueOrDefault("VGB-2034-11"));

        var storage = service.Services.GetRequiredService<Monitor.Service.Storage.StorageFaultGate>();
        Assert.Equal(0, await Position());

        Volatile.Write(ref fail.Value, true);
        await service.Harness.Bus.Publish(ServiceUnderTest.Trade("L-1", 1, "new", "RATES-CORE", "VGB-2034-11", 3_000_000));
        await ServiceUnderTest.WaitUntilAsync(() => !writer.IsHealthy && storage.IsFailing, "a failed log write held by the storage gate");
        // Held, not faulted: the write is retried under the engine's lock (so the books cannot be read meanwhile).
        Assert.Equal(Monitor.Service.Storage.StorageFaultGate.ExposureLog, Assert.Single(storage.Faults).Store);

        Volatile.Write(ref fail.Value, false);
        // The gate waits on the service's (fake) clock before each retry: move it until the held write goes through.
        await ServiceUnderTest.WaitUntilAsync(() =>
        {
            service.Time.Advance(TimeSpan.FromSeconds(1));
            return !storage.IsFailing;
        }, "the held log write retried");
        await ServiceUnderTest.WaitUntilAsync(async () => await Position() != 0, "the retried trade applied");
        Assert.Equal(3_000_000, await Position());
        Assert.False(storage.IsFailing);
        Assert.Equal(1, await service.Pipeline.ReadAsync(e => e.Trades.Count));
        Assert.False(await service.Harness.Published.Any<Fault<TradeBooked>>());
        // Exactly one complete trade record for L-1 in the exposure log (the failed attempt left at most a torn line).
        var records = Directory.GetFiles(service.LogFolder, "*.jsonl").SelectMany(File.ReadAllLines) // not writer.lock: held share-none
            .Where(l => l.Contains("\"L-1\"", StringComparison.Ordinal) && IsJson(l)).ToArray();
        Assert.Single(records);
    }

    private static bool IsJson(string line)
    {
        try
        {
            using var document = System.Text.Json.JsonDocument.Parse(line);
            return true;
        }
        catch (System.Text.Json.JsonException)
        {
            return false;
        }
    }

    private static double Dv01(RiskEngine engine) => engine.Books["RATES-CURVE"].Exposures!.Totals[ExposureMeasure.Dv01];

    private static void Accept(RiskEngine engine, IReadOnlyList<BondQuote> quotes)
    {
        foreach (var q in quotes)
        {
            engine.AcceptQuote(q, TestMarket.Now);
        }
        engine.RefitDirtyCurves(TestMarket.Now);
    }

    private static TradeInput InboundTrade(TradeBooked m) => Monitor.Service.Consumers.InboundMapper.ToTrade(m);
}
