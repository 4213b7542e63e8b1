using System.Diagnostics;
using System.Text.Json;
using System.Text.Json.Nodes;
using Monitor.Service.Audit;
using Monitor.Service.Engine;
using Monitor.Service.Journal;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// What one fault test needs: a temp folder with the service's configuration, exposure log and journal, a
/// throw-away RabbitMQ virtual host, and the checks of what the service ended up with.
/// </summary>
public sealed class FaultRig : IAsyncDisposable
{
    public static readonly string[] InboundQueues = ["monitor-trades", "monitor-quotes"];

    private FaultRig(string folder, string vhost)
    {
        Folder = folder;
        VirtualHost = vhost;
    }

    public string Folder { get; }

    public string VirtualHost { get; }

    public string DataFolder => Path.Combine(AppContext.BaseDirectory, "Data");

    public string ConfigFile => Path.Combine(Folder, "service.json");

    public string ExposureLogFolder => Path.Combine(Folder, "exposure-log");

    public string JournalFolder => Path.Combine(Folder, "journal");

    public static async Task<FaultRig> CreateAsync()
    {
        var folder = Path.Combine(Path.GetTempPath(), "monitor-faults-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        var rig = new FaultRig(folder, "monitor-faults-" + Guid.NewGuid().ToString("N")[..12]);
        await BrokerAdmin.CreateVirtualHostAsync(rig.VirtualHost);
        rig.WriteConfig();
        return rig;
    }

    public ServiceProcess StartService(IReadOnlyDictionary<string, string>? environment = null) =>
        ServiceProcess.Start(ConfigFile, Folder, BrokerAdmin.User, BrokerAdmin.Password, environment);

    /// <summary>Waits until the service has declared its inbound queues (it is consuming).</summary>
    public static async Task WaitForQueuesAsync(Publisher publisher, ServiceProcess service, TimeSpan timeout)
    {
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed < timeout)
        {
            if (service.HasExited)
            {
                throw new InvalidOperationException($"the service exited during start-up. Output:\n{service.Tail()}");
            }
            var counts = await Task.WhenAll(InboundQueues.Select(publisher.ReadyCountAsync));
            if (counts.All(c => c is not null))
            {
                return;
            }
            await Task.Delay(200);
        }
        throw new TimeoutException($"the service did not declare {string.Join(", ", InboundQueues)} within {timeout}. Output:\n{service.Tail()}");
    }

    /// <summary>
    /// Waits until both inbound queues are empty and the journal holds the last version of every trade of the stream
    /// (a ready count of 0 alone does not show that the last delivered message was processed).
    /// </summary>
    public async Task WaitForDrainAsync(Publisher publisher, ServiceProcess service, TradeStream stream, TimeSpan timeout)
    {
        var clock = Stopwatch.StartNew();
        var missing = -1;
        while (clock.Elapsed < timeout)
        {
            if (service.HasExited)
            {
                throw new InvalidOperationException($"the service exited while draining. Output:\n{service.Tail()}");
            }
            var counts = await Task.WhenAll(InboundQueues.Select(publisher.ReadyCountAsync));
            var latest = JournalLatest();
            missing = stream.LastVersions.Count(p => !latest.TryGetValue(p.Key, out var t) || t.Version != p.Value);
            if (counts.All(c => c == 0) && missing == 0)
            {
                return;
            }
            await Task.Delay(500);
        }
        throw new TimeoutException($"not drained within {timeout}: {missing} trades short of their last version in the journal. Output:\n{service.Tail()}");
    }

    /// <summary>Every journal day file of the run read back with JournalReplay, in day order.</summary>
    public IReadOnlyList<JournalContents> JournalFiles() =>
        Directory.Exists(JournalFolder)
            ? Directory.GetFiles(JournalFolder, "journal-*.jsonl").Order(StringComparer.Ordinal).Select(p => JournalReplay.ReadFile(TestKey.Value, p)).ToList()
            : [];

    /// <summary>The journal's latest version of every trade (what the service's recovery rebuilds the books from).</summary>
    public Dictionary<string, TradeInput> JournalLatest()
    {
        var latest = new Dictionary<string, TradeInput>(StringComparer.Ordinal);
        foreach (var trade in JournalFiles().SelectMany(f => f.Trades))
        {
            if (!latest.TryGetValue(trade.TradeId, out var kept) || kept.Version < trade.Version)
            {
                latest[trade.TradeId] = trade;
            }
        }
        return latest;
    }

    /// <summary>Face per (book, instrument) the service holds: start-of-day positions plus the journal's last version of each trade.</summary>
    public Dictionary<(string Book, string Instrument), double> ServicePositions(IReadOnlyDictionary<(string Book, string Instrument), double> startOfDay)
    {
        var positions = new Dictionary<(string, string), double>(startOfDay);
        foreach (var trade in JournalLatest().Values.Where(t => t.Action != TradeAction.Cancel))
        {
            positions[(trade.Book, trade.InstrumentId)] = positions.GetValueOrDefault((trade.Book, trade.InstrumentId)) + trade.FaceAmount;
        }
        return positions;
    }

    /// <summary>Exposure log records of one kind, as (payload) JSON objects, in log order.</summary>
    public List<JsonObject> ExposureRecords(string kind)
    {
        var records = new List<JsonObject>();
        if (!Directory.Exists(ExposureLogFolder))
        {
            return records;
        }
        foreach (var file in Directory.GetFiles(ExposureLogFolder, "exposures-*.jsonl").Order(StringComparer.Ordinal))
        {
            foreach (var line in File.ReadLines(file))
            {
                if (JsonNode.Parse(line) is JsonObject record && (string?)record["kind"] == kind)
                {
                    records.Add((JsonObject)record["payload"]!);
                }
            }
        }
        return records;
    }

    public ExposureLogVerification VerifyExposureLog() => ExposureLogVerifier.VerifyFolder(TestKey.Value, ExposureLogFolder);

    public async ValueTask DisposeAsync()
    {
        await BrokerAdmin.DeleteVirtualHostAsync(VirtualHost);
        try
        {
            Directory.Delete(Folder, recursive: true);
        }
        catch (IOException)
        {
        }
    }

    private void WriteConfig()
    {
        var config = new JsonObject
        {
            ["Monitor"] = new JsonObject
            {
                ["InstrumentsFile"] = Path.Combine(DataFolder, "instruments.csv"),
                ["PositionsFile"] = Path.Combine(DataFolder, "positions.csv"),
                ["LimitsFile"] = Path.Combine(DataFolder, "limits.json"),
                ["BaseCurveModel"] = "NelsonSiegel",
                ["ConflationWindow"] = "00:00:00.020",
                ["SnapshotInterval"] = "00:05:00",
                ["StaleQuoteAfter"] = "04:00:00",
                ["BaseMaxRmseBp"] = 5,
                ["BaseMaxErrorBp"] = 25,
                ["BaseMinQuotes"] = 6,
                ["SpreadMaxRmseBp"] = 15,
                ["SpreadMaxErrorBp"] = 60,
                ["SpreadMinQuotes"] = 4,
            },
            ["Transport"] = new JsonObject
            {
                ["Kind"] = "RabbitMq",
                ["ConcurrentMessageLimit"] = 1,
                ["Broker"] = new JsonObject { ["Host"] = "localhost", ["Port"] = 5672, ["VirtualHost"] = VirtualHost, ["UseTls"] = false },
            },
            ["ExposureLog"] = new JsonObject { ["Folder"] = ExposureLogFolder, ["FlushToDisk"] = true },
            ["Journal"] = new JsonObject { ["Folder"] = JournalFolder },
            ["Record"] = new JsonObject { ["KeyFile"] = TestKey.FileIn(Folder) },
            ["Serilog"] = new JsonObject
            {
                ["Using"] = new JsonArray("Serilog.Sinks.Console"),
                ["MinimumLevel"] = new JsonObject
                {
                    ["Default"] = "Information",
                    ["Override"] = new JsonObject { ["MassTransit"] = "Warning", ["Microsoft"] = "Warning" },
                },
                ["WriteTo"] = new JsonArray(new JsonObject
                {
                    ["Name"] = "Console",
                    ["Args"] = new JsonObject { ["outputTemplate"] = "{Timestamp:HH:mm:ss.fff} [{Level:u3}] {SourceContext}: {Message:lj}{NewLine}{Exception}" },
                }),
            },
        };
        File.WriteAllText(ConfigFile, config.ToJsonString(new JsonSerializerOptions { WriteIndented = true }));
    }
}
