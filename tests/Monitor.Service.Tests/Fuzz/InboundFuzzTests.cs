using System.Globalization;
using System.Text.Json;
using MassTransit.Serialization;
using Monitor.Contracts.V1;
using Monitor.Service.Consumers;
using Monitor.Service.Engine;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Journal;
using Xunit.Abstractions;

namespace Monitor.Service.Tests.Fuzz;

/// <summary>
/// Property (issue 5, "Bad input"): 12,000 random and mutated inbound messages go down the consumer's path:
/// System.Text.Json with MassTransit's own serializer options, then InboundMapper, then the RiskEngine method.
/// No exception other than JsonException (naming the path or the missing property) or MessageRejectedException
/// (naming a wire field and a reason); a refused message leaves the engine's state exactly as it was.
/// Seeded (seed below), so a failure replays; the failing case's JSON is in the message.
/// </summary>
public sealed class InboundFuzzTests(ITestOutputHelper output)
{
    private const int Seed = 20261201;
    private static readonly int Cases = int.TryParse(Environment.GetEnvironmentVariable("MONITOR_FUZZ_CASES"), out var n) ? n : 12_000;
    private const string Matured = "OLD-2026-03";

    private static readonly HashSet<string> WireFields = new(StringComparer.Ordinal)
    {
        "tradeId", "version", "action", "book", "instrumentId", "faceAmount", "cleanPrice", "tradeTime",
        "quoteId", "bidCleanPrice", "askCleanPrice", "midCleanPrice", "yield", "quoteTime", "source", "mid",
        "issuer", "spreadGroup", "currency", "couponRate", "frequency", "dayCount", "issueDate", "firstCouponDate", "maturityDate", "face", "settlementLagDays", "id",
    };

    [Fact]
    public void Random_and_mutated_messages_are_accepted_or_refused_with_a_reason_and_refusals_change_nothing()
    {
        var options = SystemTextJsonMessageSerializer.Options;
        var engine = JournalTestEngine.CreateFitted(); // fitted: accepted trades revalue their book and evaluate limits
        var now = JournalTestEngine.Now;
        engine.DefineInstrument(new Analytics.Instruments.Bond(Matured, "Fuzz Issuer", null, "XTS", 0.02m, 2, Analytics.Dates.DayCountConvention.ActActIcma,
            new DateOnly(2021, 3, 15), null, new DateOnly(2026, 3, 15), 100m, 1));
        var books = engine.Books.Keys.Order(StringComparer.Ordinal).ToArray();
        var instruments = engine.Instruments.Values.Where(b => b.MaturityDate > engine.ValuationDate).Select(b => b.Id).Order(StringComparer.Ordinal).ToArray();
        var generator = new InboundMessageGenerator(Seed, books, instruments, Matured, now);
        var tradeIds = new List<string>();
        var seenIds = new HashSet<string>(StringComparer.Ordinal);
        var tally = new SortedDictionary<string, int[]>(StringComparer.Ordinal); // category -> [accepted, json refused, mapper/engine refused]
        var fields = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var failures = new List<string>();

        var clock = System.Diagnostics.Stopwatch.StartNew();
        var spent = new SortedDictionary<string, double>(StringComparer.Ordinal);
        for (var i = 0; i < Cases && failures.Count < 5; i++)
        {
            var fuzz = generator.Next();
            var started = clock.Elapsed.TotalMilliseconds;
            try
            {
                RunCase(i, fuzz);
            }
            finally
            {
                spent[fuzz.Category] = spent.GetValueOrDefault(fuzz.Category) + clock.Elapsed.TotalMilliseconds - started;
            }
        }
                output.WriteLine("ms by category: " + string.Join(", ", spent.Select(s => $"{s.Key} {s.Value:F0}")));

        void RunCase(int i, FuzzCase fuzz)
        {
            var counts = tally.TryGetValue(fuzz.Category, out var c) ? c : tally[fuzz.Category] = new int[3];
            object? message;
            try
            {
                message = fuzz.Contract switch
                {
                    "TradeBooked" => JsonSerializer.Deserialize<TradeBooked>(fuzz.Json, options),
                    "BondQuoted" => JsonSerializer.Deserialize<BondQuoted>(fuzz.Json, options),
                    _ => JsonSerializer.Deserialize<InstrumentDefined>(fuzz.Json, options),
                };
            }
            catch (JsonException ex)
            {
                // STJ names the JSON path ($.faceAmount) or, for absent required members, the property names.
                if (string.IsNullOrEmpty(ex.Path) && !ex.Message.Contains("required properties", StringComparison.Ordinal))
                {
                    failures.Add($"case {i} ({fuzz.Category}): JsonException without a path: {ex.Message} | {Clip(fuzz.Json)}");
                }
                counts[1]++;
                return;
            }
            catch (Exception ex)
            {
                failures.Add($"case {i} ({fuzz.Category}): {ex.GetType().Name} in deserialization: {ex.Message} | {Clip(fuzz.Json)}");
                return;
            }
            if (message is null)
            {
                counts[1]++; // the JSON literal null: MassTransit has no message to deliver
                return;
            }
            if (message is TradeBooked { TradeId: { } id })
            {
                if (seenIds.Add(id))
                {
                    tradeIds.Add(id);
                }
            }
            var fp = clock.Elapsed.TotalMilliseconds;
            var before = EngineFingerprint.Of(engine, tradeIds);
            spent["~fingerprint"] = spent.GetValueOrDefault("~fingerprint") + clock.Elapsed.TotalMilliseconds - fp;
            try
            {
                switch (message)
                {
                    case TradeBooked t:
                        engine.ApplyTrade(InboundMapper.ToTrade(t), now);
                        break;
                    case BondQuoted q:
                        engine.AcceptQuote(InboundMapper.ToQuote(q), now);
                        break;
                    case InstrumentDefined d:
                        engine.DefineInstrument(InboundMapper.ToBond(d));
                        break;
                }
                counts[0]++;
            }
            catch (MessageRejectedException ex)
            {
                counts[2]++;
                fields[ex.Field] = fields.GetValueOrDefault(ex.Field) + 1;
                if (!WireFields.Contains(ex.Field) || string.IsNullOrWhiteSpace(ex.Reason))
                {
                    failures.Add($"case {i} ({fuzz.Category}): refusal without a known field or a reason: field '{ex.Field}', reason '{ex.Reason}'");
                }
                var after = EngineFingerprint.Of(engine, tradeIds);
                if (!string.Equals(before, after, StringComparison.Ordinal))
                {
                    failures.Add($"case {i} ({fuzz.Category}): refused ({ex.Message}) but the engine state changed | {Clip(fuzz.Json)}");
                }
            }
            catch (Exception ex)
            {
                failures.Add($"case {i} ({fuzz.Category}, {fuzz.Contract}): {ex.GetType().Name}: {ex.Message} | {Clip(fuzz.Json)}");
            }
        }

        output.WriteLine($"seed {Seed}, {Cases} cases; serializer NumberHandling = {options.NumberHandling}, case-insensitive = {options.PropertyNameCaseInsensitive}");
        output.WriteLine("category: accepted / refused by JSON / refused by mapper or engine");
        foreach (var (category, n) in tally)
        {
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  {category}: {n[0]} / {n[1]} / {n[2]}"));
        }
        output.WriteLine("refusals by field: " + string.Join(", ", fields.Select(f => $"{f.Key} {f.Value}")));
        var refusedByJson = tally.Values.Sum(n => n[1]);
        var refusedByRules = tally.Values.Sum(n => n[2]);
        FiguresFile.Report(output, string.Create(CultureInfo.InvariantCulture,
            $"bad input: {Cases:N0} random and mutated messages tried (seed {Seed}); refused {refusedByJson + refusedByRules:N0} ({refusedByJson:N0} by JSON, {refusedByRules:N0} by mapper or engine), " +
            $"accepted {tally.Values.Sum(n => n[0]):N0}; refusals without a field and reason or with a state change, and crashes: {failures.Count}"));
        Assert.True(failures.Count == 0, string.Join("\n", failures));
        Assert.Equal(Cases, tally.Values.Sum(n => n[0] + n[1] + n[2]));
        Assert.All(tally.Values, n => Assert.True(n[1] + n[2] > 0, "every category has refusals"));
    }

    private static string Clip(string json) => json.Length > 300 ? json[..300] + $"... ({json.Length} chars)" : json;
}
