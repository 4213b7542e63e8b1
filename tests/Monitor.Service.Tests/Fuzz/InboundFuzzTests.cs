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
        "quoteId", "bidCleanPrice", "askCleanPrice", "midCleanPrice", "yield", "quoteTime", "source",
        "issuer", "spreadGroup", "currency", "couponRate", "frequency", "dayCount", "issueDate", "firstCouponDate", "maturityDate", "face", "settlementLagDays",
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
        var samples = new SortedDictionary<string, string>(StringComparer.Ordinal); // one refusal text per field and kind of reason

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
                // What the endpoint's refusal filter makes of it: the wire field and a reason in words.
                var contract = fuzz.Contract switch { "TradeBooked" => typeof(TradeBooked), "BondQuoted" => typeof(BondQuoted), _ => typeof(InstrumentDefined) };
                var refusal = JsonRefusal.From(ex, contract, fuzz.Json);
                fields["json " + refusal.Field] = fields.GetValueOrDefault("json " + refusal.Field) + 1;
                CheckRefusal(i, fuzz, refusal, allowBody: fuzz.Category == "malformed-json");
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
                CheckRefusal(i, fuzz, ex, allowBody: false);
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

        void CheckRefusal(int i, FuzzCase fuzz, MessageRejectedException ex, bool allowBody)
        {
            samples.TryAdd(ex.Field + " " + string.Join(' ', ex.Reason.Split(' ').Take(2)), ex.Message);
            if (RefusalProblem(ex, allowBody) is { } problem)
            {
                failures.Add($"case {i} ({fuzz.Category}): {problem}: field '{ex.Field}', reason '{ex.Reason}' | {Clip(fuzz.Json)}");
            }
        }

        output.WriteLine($"seed {Seed}, {Cases} cases; serializer NumberHandling = {options.NumberHandling}, case-insensitive = {options.PropertyNameCaseInsensitive}");
        output.WriteLine("category: accepted / refused by JSON / refused by mapper or engine");
        foreach (var (category, n) in tally)
        {
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  {category}: {n[0]} / {n[1]} / {n[2]}"));
        }
        output.WriteLine("one refusal of each kind:");
        foreach (var sample in samples.Values)
        {
            output.WriteLine("  " + sample);
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

    /// <summary>Why a refusal's text fails the rule (a wire field, a reason in words, no .NET text, ISO 8601 dates), or null.</summary>
    internal static string? RefusalProblem(MessageRejectedException ex, bool allowBody)
    {
        var field = ex.Field;
        if (!(WireFields.Contains(field) || (allowBody && field == JsonRefusal.BodyField)))
        {
            return "not a wire field";
        }
        if (string.IsNullOrWhiteSpace(ex.Reason))
        {
            return "no reason";
        }
        foreach (var text in new[] { ex.Message, ex.Reason })
        {
            foreach (var dotnet in DotNetText)
            {
                if (text.Contains(dotnet, StringComparison.Ordinal))
                {
                    return $"reason carries .NET text '{dotnet}'";
                }
            }
            if (System.Text.RegularExpressions.Regex.IsMatch(text, @"\b\d{1,2}/\d{1,2}/\d{4}\b"))
            {
                return "a date not in ISO 8601";
            }
        }
        return null;
    }

    /// <summary>Text of the runtime, the JSON reader or a C# record's ToString, never meant for a producer.</summary>
    private static readonly string[] DotNetText =
    [
        "Parameter '", "Actual value", "   at ", "System.", "Monitor.", "LineNumber", "BytePosition", "Path: $", " { ", "could not be converted",
        "invalid start of a value", "Exception",
    ];

    private static string Clip(string json) => json.Length > 300 ? json[..300] + $"... ({json.Length} chars)" : json;
}
