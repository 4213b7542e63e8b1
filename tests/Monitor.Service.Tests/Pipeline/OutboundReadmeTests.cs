using System.Text.Json;
using System.Text.Json.Nodes;
using MassTransit.Serialization;
using Monitor.Contracts.V1;
using Monitor.Service.Consumers;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// Issue 11: src/Monitor.Contracts/README.md's outbound examples against what a scripted service on the in-memory bus
/// publishes, serialised with MassTransit's own JSON options: every field the service sends is in the example, and the
/// example's enumeration-like values (model, causeMessageType, scope, measure, status) are spelled as the service
/// spells them. The inbound ParYieldsPublished example must be accepted.
/// </summary>
public sealed class OutboundReadmeTests : IDisposable
{
    private static readonly string[] SpelledFields = ["model", "causeMessageType", "scope", "measure", "status", "previousStatus"];
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task The_readme_examples_have_the_fields_and_spellings_of_the_published_messages()
    {
        var limits = TestMarket.WriteLimits(_folder.Path,
            "{ \"id\": \"t-tiny-dv01\", \"scope\": \"book\", \"scopeId\": \"RATES-CURVE\", \"measure\": \"dv01\", \"upper\": 1 }");
        var published = new Dictionary<string, List<JsonObject>>(StringComparer.Ordinal);
        await using (var service = await ServiceUnderTest.StartAsync(limits))
        {
            await service.RefitAsync();
            await service.TradeAsync(ServiceUnderTest.Trade("D-1", 1, "new", "RATES-CURVE", "VGB-2051-11", -1_000_000));
            foreach (var message in service.Harness.Published.Select<object>().Select(p => p.Context.Message))
            {
                var name = message.GetType().Name;
                var json = JsonSerializer.SerializeToNode(message, message.GetType(), SystemTextJsonMessageSerializer.Options)!.AsObject();
                (published.TryGetValue(name, out var list) ? list : published[name] = []).Add(json);
            }
        }
        Assert.Contains(nameof(CurveFitted), published.Keys);
        Assert.Contains(nameof(BookExposuresBatch), published.Keys);
        Assert.Contains(nameof(LimitStatusChanged), published.Keys);

        var readme = File.ReadAllText(Path.Combine(RepositoryRoot(), "src", "Monitor.Contracts", "README.md"));
        var problems = new List<string>();
        foreach (var (type, messages) in published)
        {
            var example = Example(readme, type);
            if (example is null)
            {
                problems.Add($"{type}: no example in the README");
                continue;
            }
            var sent = new SortedSet<string>(StringComparer.Ordinal);
            var values = new Dictionary<string, HashSet<string>>(StringComparer.Ordinal);
            foreach (var message in messages)
            {
                Walk(message, "", sent, values);
            }
            var documented = new SortedSet<string>(StringComparer.Ordinal);
            var documentedValues = new Dictionary<string, HashSet<string>>(StringComparer.Ordinal);
            Walk(example, "", documented, documentedValues);
            problems.AddRange(sent.Except(documented).Select(f => $"{type}: the service sends '{f}', the README example has no such field"));
            foreach (var (field, spellings) in documentedValues)
            {
                // The same word in another case (nelsonSiegel for NelsonSiegel), or a full type name where the service sends a short one.
                if (values.TryGetValue(field, out var seen) && spellings.Any(d =>
                    seen.Any(s => string.Equals(s, d, StringComparison.OrdinalIgnoreCase) && s != d) || (d.Contains('.', StringComparison.Ordinal) && !seen.Any(s => s.Contains('.', StringComparison.Ordinal)))))
                {
                    problems.Add($"{type}: '{field}' is {string.Join("/", spellings)} in the README, {string.Join("/", seen)} from the service");
                }
            }
        }
        Assert.True(problems.Count == 0, string.Join("\n", problems));

        // The inbound example is one the service accepts.
        var parYields = JsonSerializer.Deserialize<ParYieldsPublished>(Example(readme, nameof(ParYieldsPublished))!.ToJsonString(), SystemTextJsonMessageSerializer.Options)!;
        var engine = TestMarket.Engine();
        engine.ApplyParYields(parYields.CurveId, TestMarket.Now.AddMinutes(-1), InboundMapper.ToParYields(parYields), TestMarket.Now);
    }

    /// <summary>Collects field paths (array elements as <c>[]</c>) and the values of the spelled fields.</summary>
    private static void Walk(JsonNode? node, string path, ISet<string> fields, Dictionary<string, HashSet<string>> values)
    {
        switch (node)
        {
            case JsonObject o:
                foreach (var (key, value) in o)
                {
                    var field = path.Length == 0 ? key : path + "." + key;
                    fields.Add(field);
                    if (SpelledFields.Contains(key) && value is JsonValue v && v.TryGetValue<string>(out var text))
                    {
                        (values.TryGetValue(field, out var set) ? set : values[field] = []).Add(text);
                    }
                    // A dictionary of measures (names are data, not fields) is compared as one field.
                    if (key != "measures")
                    {
                        Walk(value, field, fields, values);
                    }
                }
                break;
            case JsonArray a:
                foreach (var item in a)
                {
                    Walk(item, path + "[]", fields, values);
                }
                break;
        }
    }

    private static JsonObject? Example(string readme, string type)
    {
        var heading = readme.IndexOf($"\n### {type}\n", StringComparison.Ordinal);
        if (heading < 0)
        {
            return null;
        }
        var start = readme.IndexOf("```json\n", heading, StringComparison.Ordinal) + "```json\n".Length;
        var end = readme.IndexOf("\n```", start, StringComparison.Ordinal);
        return JsonNode.Parse(readme[start..end])!.AsObject();
    }

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "Monitor.sln")))
            {
                return dir.FullName;
            }
        }
        throw new DirectoryNotFoundException("no Monitor.sln above " + AppContext.BaseDirectory);
    }
}
