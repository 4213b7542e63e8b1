using System.Globalization;
using System.Text.Json;
using Microsoft.Extensions.Configuration;
using Monitor.Analytics.Market;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// What the stream implies at its end, computed in this process with the pure <see cref="RiskEngine"/> and no
/// messaging: the service's own start-of-day files and settings (read from the rig's configuration), every trade
/// message of the stream applied in the order it was published, then the newest quote of each instrument and one
/// refit. Limit statuses here start from Within, as a freshly started service's do.
/// </summary>
public sealed class StreamReference
{
    private StreamReference(RiskEngine engine, EngineResult refit)
    {
        Engine = engine;
        Refit = refit;
    }

    public RiskEngine Engine { get; }

    /// <summary>The final refit: curves fitted, books valued, limit changes from Within.</summary>
    public EngineResult Refit { get; }

    public static StreamReference Compute(string configFile, TradeStream stream, DateTimeOffset now)
    {
        var options = new ConfigurationBuilder().AddJsonFile(configFile).Build()
            .GetSection(MonitorOptions.SectionName).Get<MonitorOptions>()
            ?? throw new InvalidOperationException($"{configFile} has no {MonitorOptions.SectionName} section");
        var engine = EngineFactory.Create(options, TimeProvider.System);
        var newestQuotes = new Dictionary<string, BondQuote>(StringComparer.Ordinal);
        foreach (var message in stream.Messages)
        {
            using var json = JsonDocument.Parse(message.Json);
            var m = json.RootElement;
            if (message.TradeId is not null)
            {
                var trade = new TradeInput(
                    m.GetProperty("tradeId").GetString()!,
                    m.GetProperty("version").GetInt32(),
                    Enum.Parse<TradeAction>(m.GetProperty("action").GetString()!, ignoreCase: true),
                    m.GetProperty("book").GetString()!,
                    m.GetProperty("instrumentId").GetString()!,
                    m.GetProperty("faceAmount").GetDouble(),
                    m.GetProperty("cleanPrice").GetDouble(),
                    DateTimeOffset.Parse(m.GetProperty("tradeTime").GetString()!, CultureInfo.InvariantCulture));
                var outcome = engine.ApplyTrade(trade, now).Trade;
                if (outcome != TradeOutcome.Applied)
                {
                    throw new InvalidOperationException($"the stream's trade {trade.TradeId} v{trade.Version} was {outcome} in the reference engine");
                }
            }
            else
            {
                var quote = new BondQuote(
                    m.GetProperty("instrumentId").GetString()!,
                    DateTimeOffset.Parse(m.GetProperty("quoteTime").GetString()!, CultureInfo.InvariantCulture),
                    m.GetProperty("bidCleanPrice").GetDouble(),
                    m.GetProperty("askCleanPrice").GetDouble(),
                    mid: null,
                    yield: null,
                    m.GetProperty("source").GetString());
                newestQuotes[quote.InstrumentId] = quote; // quote times rise along the stream
            }
        }
        foreach (var quote in newestQuotes.Values)
        {
            engine.AcceptQuote(quote, now);
        }
        return new StreamReference(engine, engine.RefitDirtyCurves(now));
    }

    /// <summary>The exposure a limit is measured on, from the reference books.</summary>
    public double ExposureOf(LimitDefinition limit) => Engine.Limits.ExposureOf(limit.Scope, limit.Measure, limit.SpreadGroup);
}
