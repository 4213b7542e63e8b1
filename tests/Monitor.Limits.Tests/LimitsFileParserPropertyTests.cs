using System.Text.Json.Nodes;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using Monitor.Limits;

namespace Monitor.Limits.Tests;

// Bad configuration must stop start-up with a message, never with an unexplained crash: whatever a
// mutated or truncated limits file contains, the parser either returns a configuration that a
// LimitSet accepts or throws LimitConfigurationException whose every error names a path.
public class LimitsFileParserPropertyTests
{
    private static readonly string Example = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Data", "limits-example.json"));

    private static readonly string[] Properties =
        ["id", "scope", "scopeId", "spreadGroup", "measure", "lower", "upper", "warning", "hysteresis", "expiresAt", "extra"];

    private static readonly string[] Values =
        ["null", "\"\"", "-1", "0", "1", "2", "0.5", "1e308", "-1e308", "true", "[]", "{}", "\"x\"", "\"desk\"", "\"book\"", "\"firm\"", "\"rates\"", "\"dv01\"", "\"2026-12-01T17:00:00Z\"", "\"2026-13-45\""];

    [Property(MaxTest = 500)]
    public Property Mutated_files_parse_or_fail_with_named_errors()
    {
        var mutation =
            from edits in Gen.ListOf(
                from limit in Gen.Choose(0, 8)
                from property in Gen.Elements(Properties)
                from value in Gen.Elements(Values)
                from remove in Gen.Elements(false, false, false, true)
                select (limit, property, value, remove))
            from truncateAt in Gen.Frequency((9, Gen.Constant(-1)), (1, Gen.Choose(0, Example.Length)))
            select (edits, truncateAt);

        return Prop.ForAll(Arb.From(mutation), m =>
        {
            var root = JsonNode.Parse(Example)!;
            var limits = root["limits"]!.AsArray();
            foreach (var (limit, property, value, remove) in m.edits)
            {
                if (limit >= limits.Count)
                {
                    limits.Add(JsonNode.Parse("{}"));
                    continue;
                }

                var target = limits[limit]!.AsObject();
                if (remove)
                {
                    target.Remove(property);
                }
                else
                {
                    target[property] = JsonNode.Parse(value);
                }
            }

            var text = root.ToJsonString();
            if (m.truncateAt >= 0)
            {
                text = text[..Math.Min(m.truncateAt, text.Length)];
            }

            try
            {
                var config = LimitsFileParser.Parse(text);
                return config.CreateLimitSet().Limits.Count == config.Limits.Count;
            }
            catch (LimitConfigurationException e)
            {
                return e.Errors.Count > 0 && e.Errors.All(error => error.Contains(": ", StringComparison.Ordinal));
            }
        });
    }
}
