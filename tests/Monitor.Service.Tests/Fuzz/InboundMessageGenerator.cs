using System.Globalization;
using System.Text.Json.Nodes;

namespace Monitor.Service.Tests.Fuzz;

/// <summary>
/// Seeded generator of inbound messages as a consumer receives them (camelCase JSON of Monitor.Contracts.V1):
/// a plausible message, then one mutation from a category: malformed JSON, missing or mistyped fields, bad
/// numbers (NaN/Infinity as strings, zero, negative, absurd, overflowing), unknown or matured references,
/// times far off, reused trade ids and versions, oversized strings, or none (valid).
/// </summary>
internal sealed class InboundMessageGenerator(int seed, IReadOnlyList<string> books, IReadOnlyList<string> instruments, string maturedInstrument, DateTimeOffset now)
{
    public static readonly string[] Categories =
        ["valid", "malformed-json", "missing-field", "mistyped-field", "bad-number", "unknown-reference", "matured-bond", "time-far-off", "trade-id-version", "oversized", "extra-or-recased"];

    private const string RawMarker = "__raw_number__";
    private static readonly string[] DayCounts = ["ACT/ACT-ICMA", "ACT/ACT-ISDA", "30/360", "30E/360", "ACT/360", "ACT/365F"];
    private static readonly string[] Actions = ["new", "amend", "cancel"];
    private static readonly string[] RawNumbers = ["1e400", "-1e400", "1e-400", "0", "-0", "-1", "-100.5", "1e308", "1.7976931348623157e308", "4.9e-324", "123456789012345678901234567890", "2147483648", "-2147483649", "1.5"];
    private static readonly string[] NamedLiterals = ["NaN", "Infinity", "-Infinity", "nan", "inf"];

    private readonly Random _random = new(seed);
    private int _serial;

    public FuzzCase Next()
    {
        var roll = _random.Next(100);
        var contract = roll < 50 ? "TradeBooked" : roll < 85 ? "BondQuoted" : "InstrumentDefined";
        var message = contract switch
        {
            "TradeBooked" => Trade(),
            "BondQuoted" => Quote(),
            _ => Instrument(),
        };
        var category = Categories[_random.Next(Categories.Length)];
        var json = Mutate(contract, category, message);
        return new FuzzCase(contract, category, json);
    }

    private JsonObject Trade() => new()
    {
        ["tradeId"] = "F-" + _random.Next(60).ToString(CultureInfo.InvariantCulture),
        ["version"] = 1 + _random.Next(3),
        ["action"] = Actions[_random.Next(_random.Next(4) == 0 ? 3 : 1)],
        ["book"] = Pick(books),
        ["instrumentId"] = Pick(instruments),
        ["faceAmount"] = (_random.Next(2) == 0 ? -1 : 1) * 100_000.0 * (1 + _random.Next(100)),
        ["cleanPrice"] = Math.Round(90 + (20 * _random.NextDouble()), 3),
        ["tradeTime"] = Time(now.AddMinutes(-_random.Next(600))),
    };

    private JsonObject Quote()
    {
        var quote = new JsonObject
        {
            ["quoteId"] = "Q-" + (++_serial).ToString(CultureInfo.InvariantCulture),
            ["instrumentId"] = Pick(instruments),
            ["quoteTime"] = Time(now.AddMinutes(-_random.Next(200))),
            ["source"] = "fuzz-feed",
        };
        var price = Math.Round(85 + (25 * _random.NextDouble()), 3);
        switch (_random.Next(3))
        {
            case 0:
                quote["midCleanPrice"] = price;
                break;
            case 1:
                quote["bidCleanPrice"] = price - 0.02;
                quote["askCleanPrice"] = price + 0.02;
                break;
            default:
                quote["yield"] = Math.Round(0.01 + (0.05 * _random.NextDouble()), 5);
                break;
        }
        return quote;
    }

    private JsonObject Instrument()
    {
        var issue = new DateOnly(2020, 1, 15).AddMonths(_random.Next(60));
        return new JsonObject
        {
            ["instrumentId"] = _random.Next(3) == 0 ? Pick(instruments) : "FZ-" + (++_serial).ToString(CultureInfo.InvariantCulture),
            ["issuer"] = "Fuzz Issuer",
            ["spreadGroup"] = _random.Next(3) switch { 0 => null, 1 => "INDUSTRIAL-BBB", _ => "FZ-GROUP" },
            ["currency"] = "XTS",
            ["couponRate"] = Math.Round(0.08 * _random.NextDouble(), 4),
            ["frequency"] = new[] { 1, 2, 4, 12 }[_random.Next(4)],
            ["dayCount"] = Pick(DayCounts),
            ["issueDate"] = Date(issue),
            ["maturityDate"] = Date(issue.AddYears(1 + _random.Next(30))),
            ["face"] = 100.0,
            ["settlementLagDays"] = 1,
        };
    }

    private string Mutate(string contract, string category, JsonObject m)
    {
        switch (category)
        {
            case "malformed-json":
                return Malformed(m.ToJsonString());
            case "missing-field":
                m.Remove(PickKey(m));
                break;
            case "mistyped-field":
                m[PickKey(m)] = _random.Next(6) switch
                {
                    0 => JsonValue.Create("abc"),
                    1 => JsonValue.Create(42),
                    2 => JsonValue.Create(true),
                    3 => new JsonArray(1, 2),
                    4 => new JsonObject { ["x"] = 1 },
                    _ => null,
                };
                break;
            case "bad-number":
                var numeric = NumericFields(contract);
                var field = numeric[_random.Next(numeric.Length)];
                if (_random.Next(3) == 0)
                {
                    m[field] = NamedLiterals[_random.Next(NamedLiterals.Length)];
                    return m.ToJsonString();
                }
                m[field] = RawMarker;
                return m.ToJsonString().Replace("\"" + RawMarker + "\"", RawNumbers[_random.Next(RawNumbers.Length)], StringComparison.Ordinal);
            case "unknown-reference":
                if (contract == "TradeBooked" && _random.Next(2) == 0)
                {
                    m["book"] = "NO-SUCH-BOOK";
                }
                else if (contract == "InstrumentDefined")
                {
                    m["dayCount"] = "ACT/999";
                }
                else
                {
                    m["instrumentId"] = "NO-SUCH-BOND-" + _random.Next(5).ToString(CultureInfo.InvariantCulture);
                }
                break;
            case "matured-bond":
                if (contract == "InstrumentDefined")
                {
                    m["maturityDate"] = Date(new DateOnly(2026, 1, 15));
                }
                else
                {
                    m["instrumentId"] = maturedInstrument;
                }
                break;
            case "time-far-off":
                var timeField = contract switch { "TradeBooked" => "tradeTime", "BondQuoted" => "quoteTime", _ => "maturityDate" };
                m[timeField] = contract == "InstrumentDefined"
                    ? Date(_random.Next(2) == 0 ? DateOnly.MinValue : DateOnly.MaxValue)
                    : _random.Next(4) switch
                    {
                        0 => Time(now.AddDays(1 + _random.Next(5000))),
                        1 => Time(now.AddDays(-8 - _random.Next(5000))),
                        2 => "0001-01-01T00:00:00+00:00",
                        _ => "9999-12-31T23:59:59+00:00",
                    };
                break;
            case "trade-id-version":
                if (contract == "TradeBooked")
                {
                    m["tradeId"] = "F-" + _random.Next(8).ToString(CultureInfo.InvariantCulture); // a small pool: duplicates and conflicts
                    m["version"] = new[] { 0, -1, 1, 1, 2, 2, 3, 5, int.MaxValue, int.MinValue }[_random.Next(10)];
                    m["action"] = Actions[_random.Next(3)];
                    m["faceAmount"] = _random.Next(2) == 0 ? 1_000_000.0 : 100_000.0 * (1 + _random.Next(5));
                    m["cleanPrice"] = 99.5;
                    m["tradeTime"] = Time(now.AddHours(-1));
                }
                else
                {
                    m["instrumentId"] = Pick(instruments); // redefine or requote an existing bond
                }
                break;
            case "oversized":
                var text = new string('X', _random.Next(2) == 0 ? 10_000 : 100_000);
                var stringFields = m.Where(p => p.Value is JsonValue v && v.TryGetValue<string>(out _)).Select(p => p.Key).ToArray();
                m[stringFields[_random.Next(stringFields.Length)]] = text;
                break;
            case "extra-or-recased":
                if (_random.Next(2) == 0)
                {
                    m["unexpected"] = new JsonArray(1, "two", null);
                    m["__proto__"] = "x";
                }
                else
                {
                    var key = PickKey(m);
                    var value = m[key];
                    m.Remove(key);
                    m[char.ToUpperInvariant(key[0]) + key[1..]] = value; // PascalCase on the wire
                }
                break;
        }
        return m.ToJsonString();
    }

    private string Malformed(string json) => _random.Next(8) switch
    {
        0 => json[..Math.Max(0, _random.Next(json.Length))],
        1 => json.Insert(_random.Next(json.Length), new[] { "{", "}", "\"", ",", ":", "\\", "\u0000", "]" }[_random.Next(8)]),
        2 => json.Replace(":", "=", StringComparison.Ordinal),
        3 => string.Empty,
        4 => new[] { "null", "[]", "42", "\"text\"", "true" }[_random.Next(5)],
        5 => json + "}",
        6 => json.Replace("\"", "'", StringComparison.Ordinal),
        _ => new string('[', 100_000) + new string(']', 100_000), // nesting beyond the reader's depth limit
    };

    private static string[] NumericFields(string contract) => contract switch
    {
        "TradeBooked" => ["faceAmount", "cleanPrice", "version"],
        "BondQuoted" => ["midCleanPrice", "bidCleanPrice", "askCleanPrice", "yield"],
        _ => ["couponRate", "face", "frequency", "settlementLagDays"],
    };

    private string PickKey(JsonObject m) => m.Select(p => p.Key).ElementAt(_random.Next(m.Count));

    private string Pick(IReadOnlyList<string> from) => from[_random.Next(from.Count)];

    private static string Time(DateTimeOffset t) => t.ToString("O", CultureInfo.InvariantCulture);

    private static string Date(DateOnly d) => d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
}
