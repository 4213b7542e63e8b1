using MassTransit;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Journal;
using Monitor.Service.Pipeline;
using Monitor.Service.Storage;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Hosting;

/// <summary>Wires the service: options validated on start, the engine, the pipeline and its workers, the exposure log, the bus, health.</summary>
public static class ServiceRegistration
{
    /// <summary>Name of the bus health check (receive endpoints connected to the broker) in health reports.</summary>
    public const string BusHealthCheckName = "bus";

    public static IServiceCollection AddMonitorService(this IServiceCollection services, IConfiguration configuration, Action<IBusRegistrationConfigurator>? extraConsumers = null) =>
        AddMonitorServiceCore(services, configuration, extraConsumers, static (s, bus) => s.AddMassTransit(bus));

    /// <summary>
    /// The same wiring with the MassTransit registration supplied by the caller: tests pass
    /// <c>(s, bus) =&gt; s.AddMassTransitTestHarness(bus)</c> so the harness observes the bus the service runs on.
    /// </summary>
    internal static IServiceCollection AddMonitorServiceCore(this IServiceCollection services, IConfiguration configuration, Action<IBusRegistrationConfigurator>? extraConsumers,
        Func<IServiceCollection, Action<IBusRegistrationConfigurator>, IServiceCollection> addBus)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        ArgumentNullException.ThrowIfNull(addBus);
        services.TryAddTimeProvider();
        // First of the hosted services, so it stops last: the health file says Stopped only once everything else has stopped.
        services.AddSingleton<HealthStatusFilePublisher>();
        services.AddHostedService(sp => sp.GetRequiredService<HealthStatusFilePublisher>());
        services.AddOptions<MonitorOptions>().Bind(configuration.GetSection(MonitorOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<MonitorOptions>, MonitorOptionsValidator>();
        services.AddOptions<TransportOptions>().Bind(configuration.GetSection(TransportOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<TransportOptions>, TransportOptionsValidator>();
        services.AddOptions<ExposureLogOptions>().Bind(configuration.GetSection(ExposureLogOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<ExposureLogOptions>>(new ExposureLogOptionsValidator());
        services.AddOptions<StorageOptions>().Bind(configuration.GetSection(StorageOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<StorageOptions>>(new StorageOptionsValidator());
        services.AddOptions<HealthOptions>().Bind(configuration.GetSection(HealthOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<HealthOptions>>(new HealthOptionsValidator());

        // The record key (HMAC-SHA256 of the exposure log, its checkpoints and the journal): from a secret file or the environment.
        services.AddOptions<RecordOptions>().Bind(configuration.GetSection(RecordOptions.SectionName)).ValidateOnStart();
        services.AddSingleton<IValidateOptions<RecordOptions>>(sp => new RecordOptionsValidator(
            sp.GetRequiredService<IOptions<ExposureLogOptions>>(), sp.GetRequiredService<IOptions<JournalOptions>>(), Environment.GetEnvironmentVariable));
        services.AddSingleton(sp =>
        {
            var record = sp.GetRequiredService<IOptions<RecordOptions>>().Value;
            var (key, problem) = RecordKey.Resolve(record.KeyFile, "Record:KeyFile", Environment.GetEnvironmentVariable);
            return key ?? throw new OptionsValidationException(RecordOptions.SectionName, typeof(RecordOptions), [problem!]);
        });

        services.AddMetrics();
        services.AddSingleton<MonitorMetrics>();
        // The trade journal sits beside the exposure log unless Journal:Folder names another place.
        services.AddOptions<JournalOptions>().Bind(configuration.GetSection(JournalOptions.SectionName))
            .PostConfigure<IOptions<ExposureLogOptions>>((journal, log) =>
            {
                if (string.IsNullOrWhiteSpace(journal.Folder))
                {
                    journal.Folder = log.Value.Folder.TrimEnd('/', '\\') + "-journal";
                }
            });
        // One business-day roll (Monitor:BusinessDay) names the journal's and the log's day files and closes the day.
        services.AddSingleton(sp =>
        {
            foreach (var retired in new[] { "ExposureLog:BusinessDayUtcOffset", "Journal:BusinessDayUtcOffset" })
            {
                if (configuration[retired] is not null)
                {
                    throw new OptionsValidationException(retired, typeof(BusinessDayOptions),
                        [$"{retired}: no longer read; the business day is set once by Monitor:BusinessDay:RollTime and Monitor:BusinessDay:TimeZone (IANA). Remove the key."]);
                }
            }
            return sp.GetRequiredService<IOptions<MonitorOptions>>().Value.BusinessDay.ToRoll();
        });
        AddRetention(services, configuration);
        // One writer per folder: taken before the journal is replayed or either folder written, held until disposal.
        services.AddSingleton(sp => new WriterLocks(sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value.Folder, sp.GetRequiredService<IOptions<JournalOptions>>().Value.Folder));
        services.AddSingleton(sp => AfterWriterLocks(sp, () => EngineRecovery.Start(
            EngineFactory.Create(sp.GetRequiredService<IOptions<MonitorOptions>>().Value, sp.GetRequiredService<TimeProvider>())
                .ContinuingCurveVersions(LoggedCurveVersions.Read(sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value.Folder)),
            sp.GetRequiredService<RecordKey>(),
            sp.GetRequiredService<IOptions<JournalOptions>>().Value,
            sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value,
            sp.GetRequiredService<BusinessDayRoll>(),
            sp.GetRequiredService<IOptions<MonitorOptions>>().Value.PositionsFile,
            sp.GetRequiredService<TimeProvider>().GetUtcNow())));
        services.AddSingleton(sp => sp.GetRequiredService<EngineRecovery>().Engine);
        services.AddSingleton(sp => AfterWriterLocks(sp, () => new TradeJournal(sp.GetRequiredService<RecordKey>(), sp.GetRequiredService<IOptions<JournalOptions>>().Value, sp.GetRequiredService<TimeProvider>(), sp.GetRequiredService<BusinessDayRoll>())));
        services.AddSingleton(sp => AfterWriterLocks(sp, () => new ExposureLogWriter(sp.GetRequiredService<RecordKey>(), sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value, sp.GetRequiredService<TimeProvider>(), sp.GetRequiredService<BusinessDayRoll>())));
        // Every exposure log and journal append of the pipeline runs through the gate: a storage failure stalls, never faults a message.
        services.AddSingleton<StorageFaultGate>();
        services.AddSingleton<QuoteInbox>();
        // Events with a log record wait in <ExposureLog:Folder>-outbox until the broker confirms them.
        services.AddSingleton(sp =>
        {
            var log = sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value;
            return new OutboxFile(log.Folder.TrimEnd('/', '\\') + "-outbox", log.FlushToDisk);
        });
        services.AddSingleton<EventOutbox>();
        services.AddSingleton<RiskPipeline>();
        services.AddSingleton<LimitsFileStatus>();
        services.AddSingleton<ExposureLogCheckpointer>();

        var transport = configuration.GetSection(TransportOptions.SectionName).Get<TransportOptions>() ?? new TransportOptions();
        addBus(services, bus =>
        {
            UsageReportingOff.Apply(bus);
            InboundEndpoints.AddConsumers(bus);
            extraConsumers?.Invoke(bus);
            if (transport.Kind == TransportKind.RabbitMq)
            {
                bus.UsingRabbitMq((context, cfg) =>
                {
                    BrokerConnection.Configure(cfg, transport.Broker);
                    ErrorQueueLimits.Configure(cfg, transport);
                    InboundEndpoints.Configure(context, cfg, transport);
                    cfg.ConfigureEndpoints(context);
                });
            }
            else
            {
                bus.UsingInMemory((context, cfg) =>
                {
                    InboundEndpoints.Configure(context, cfg, transport);
                    cfg.ConfigureEndpoints(context);
                });
            }
        });

        // The bus is up (endpoints bound, broker connected) before the hosted services below start, so the opening
        // fit's events are not published into a half-started bus; a broker that cannot be reached stops the start.
        services.AddOptions<MassTransitHostOptions>().Configure(o =>
        {
            o.WaitUntilStarted = true;
            o.StartTimeout = TimeSpan.FromSeconds(60);
            o.StopTimeout = TimeSpan.FromSeconds(30);
            // A consumer held by a failing disk never finishes by itself: at stop its token is cancelled after this wait, the
            // storage gate gives up with that token, and MassTransit returns the message to its queue unacknowledged.
            o.ConsumerStopTimeout = TimeSpan.FromSeconds(10);
        });

        // Started after the bus, in this order: the outbox, opening curves, then the refit loop and the snapshots.
        // Hosted services stop in reverse order, the bus last: the outbox drains while the broker is still connected.
        services.AddHostedService(sp => sp.GetRequiredService<EventOutbox>());
        // Second, so it stops just before the outbox: its stop checkpoint comes after the stop records (stop-snapshot, service-stopped) and is still published.
        services.AddHostedService<CheckpointWorker>();
        services.AddHostedService<StartOfDayService>();
        services.AddHostedService<RetentionAtStart>();
        services.AddHostedService<CurveRefitWorker>();
        services.AddHostedService<SnapshotWorker>();
        // The day's close at the roll, then its listeners in this order: a day-close checkpoint of the log, then retention for the new day.
        services.AddSingleton<IDayCloseListener, CheckpointAtDayClose>();
        services.AddSingleton<IDayCloseListener, RetentionAtDayClose>();
        services.AddHostedService<DayCloseWorker>();
        services.AddHostedService<LimitsFileWatcher>();
        services.AddHostedService<LimitExpiryWorker>();
        services.AddHealthChecks()
            .AddCheck<ExposureLogHealthCheck>("exposure-log")
            .AddCheck<CurveHealthCheck>("curves")
            .AddCheck<JournalHealthCheck>("trade-journal")
            .AddCheck<EventOutboxHealthCheck>("event-outbox")
            .AddCheck<BusConnectionHealthCheck>(BusHealthCheckName)
            .AddCheck<StorageHealthCheck>("storage")
            .AddCheck<LimitsHealthCheck>("limits");
        // No HTTP endpoint: the reports are logged on each status change and written to Health:StatusFile when set.
        services.AddSingleton<IHealthCheckPublisher>(sp => sp.GetRequiredService<HealthStatusFilePublisher>());
        services.AddOptions<HealthCheckPublisherOptions>().Configure<IOptions<HealthOptions>>((publisher, health) =>
        {
            publisher.Delay = TimeSpan.FromSeconds(1);
            publisher.Period = health.Value.Period;
            publisher.Timeout = TimeSpan.FromSeconds(10);
        });
        return services;
    }

    /// <summary>Retention of the day files (Storage/DayFileRetention): options, the closed-day evidence (replaceable), the archiver.</summary>
    private static void AddRetention(IServiceCollection services, IConfiguration configuration)
    {
        services.AddOptions<RetentionOptions>().Bind(configuration.GetSection(RetentionOptions.SectionName))
            .PostConfigure<IOptions<ExposureLogOptions>>((retention, log) =>
            {
                if (string.IsNullOrWhiteSpace(retention.ArchiveFolder) && !string.IsNullOrWhiteSpace(log.Value.Folder))
                {
                    retention.ArchiveFolder = log.Value.Folder.TrimEnd('/', '\\') + "-archive";
                }
            })
            .ValidateOnStart();
        services.AddSingleton<IValidateOptions<RetentionOptions>>(sp => new RetentionOptionsValidator(() =>
            (sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value.Folder, sp.GetRequiredService<IOptions<JournalOptions>>().Value.Folder)));
        services.TryAddSingleton<IClosedDays>(sp => new DayEndRecordClosedDays(sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value.Folder, sp.GetRequiredService<RecordKey>(), sp.GetRequiredService<IOptions<JournalOptions>>().Value.Folder));
        services.AddSingleton(sp => new DayFileRetention(
            sp.GetRequiredService<IOptions<RetentionOptions>>().Value,
            sp.GetRequiredService<IOptions<ExposureLogOptions>>().Value.Folder,
            sp.GetRequiredService<IOptions<JournalOptions>>().Value.Folder,
            sp.GetRequiredService<IClosedDays>(),
            sp.GetRequiredService<ILogger<DayFileRetention>>()));
    }

    /// <summary>Builds a service that reads or writes the log or journal folders only once their writer locks are held.</summary>
    private static T AfterWriterLocks<T>(IServiceProvider services, Func<T> create)
    {
        _ = services.GetRequiredService<WriterLocks>();
        return create();
    }

    private static void TryAddTimeProvider(this IServiceCollection services)
    {
        if (!services.Any(d => d.ServiceType == typeof(TimeProvider)))
        {
            services.AddSingleton(TimeProvider.System);
        }
    }
}
