using System.Text;
using System.Text.Json.Nodes;
using Monitor.Limits;

namespace Monitor.Limits.Tests;

public class LimitsFileParserTests
{
    private static string DataPath(string name) => Path.Combine(AppContext.BaseDirectory, "Data", name);

    private static string Example() => File.ReadAllText(DataPath("limits-example.json"));

    [Fact]
    public void The_readme_example_is_the_data_file()
    {
        var readme = File.ReadAllText(DataPath("Monitor.Limits.README.md"));
        const string fence = "Full example";
        var start = readme.IndexOf("```json", readme.IndexOf(fence, StringComparison.Ordinal), StringComparison.Ordinal) + "```json".Length;
        var end = readme.IndexOf("```", start, StringComparison.Ordinal);
        Assert.True(JsonNode.DeepEquals(JsonNode.Parse(readme[start..end]), JsonNode.Parse(Example())));
    }

    [Fact]
    public void The_full_example_parses_into_hierarchy_and_limits()
    {
        var config = LimitsFileParser.Parse(Example());
        Assert.Equal("demo-firm", config.Hierarchy.FirmId);
        Assert.Equal("credit", config.Hierarchy.DeskOf("credit-bbb"));
        Assert.Equal(8, config.Limits.Count);

        var firm = config.Limits[0];
        Assert.Equal(LimitScope.Firm("demo-firm"), firm.Scope);
        Assert.Equal((-400000.0, 400000.0), (firm.Lower!.Value, firm.Upper!.Value));
        Assert.Equal((0.8, 0.05), (firm.WarningFraction, firm.HysteresisFraction)); // from defaults

        var slope = config.Limits.Single(l => l.Id == "rates-slope");
        Assert.Equal(ExposureMeasure.BaseSlope, slope.Measure);
        Assert.Equal((0.75, 0.03), (slope.WarningFraction, slope.HysteresisFraction)); // overrides

        var temp = config.Limits.Single(l => l.Id == "credit-bbb-dv01-temp");
        Assert.Equal(LimitScope.Book("credit-bbb"), temp.Scope);
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 17, 0, 0, TimeSpan.Zero), temp.ExpiresAt);
        Assert.Null(temp.Lower);

        var spread = config.Limits[7];
        Assert.Equal(("corp-bbb", ExposureMeasure.SpreadSlope, LimitScope.Desk("credit")), (spread.SpreadGroup, spread.Measure, spread.Scope));
        Assert.Null(firm.SpreadGroup);

        var set = config.CreateLimitSet();
        Assert.Equal(8, set.Limits.Count);
    }

    [Fact]
    public void A_stream_parses_like_a_string()
    {
        using var stream = new MemoryStream(Encoding.UTF8.GetBytes(Example()));
        Assert.Equal(8, LimitsFileParser.Parse(stream).Limits.Count);
    }

    [Theory]
    [InlineData("warning", "1.2", "limits[3].warning: 1.2 is above 1; use a fraction such as 0.8")]
    [InlineData("warning", "0", "limits[3].warning: 0 is not above 0")]
    [InlineData("hysteresis", "-0.1", "limits[3].hysteresis: -0.1 is negative")]
    [InlineData("hysteresis", "0.9", "limits[3].hysteresis: 0.9 is not below the warning fraction 0.75")]
    [InlineData("upper", "-5", "limits[3].upper: -5 is not above zero")]
    [InlineData("lower", "10", "limits[3].lower: 10 is not below zero")]
    [InlineData("upper", "\"120k\"", "limits[3].upper: \"120k\" is not a number")]
    [InlineData("measure", "\"dv1\"", "limits[3].measure: \"dv1\" is not a measure; use one of: marketValue, dv01,")]
    [InlineData("scope", "\"team\"", "limits[3].scope: \"team\" is not a scope; use \"firm\", \"desk\" or \"book\"")]
    [InlineData("scopeId", "\"fx\"", "limits[3].scopeId: \"fx\" is not a desk listed in desks; add it to desks or use one of: rates, credit")]
    [InlineData("expiresAt", "\"2026-12-01T17:00:00\"", "limits[3].expiresAt: \"2026-12-01T17:00:00\" is not an ISO 8601 time with an offset")]
    [InlineData("spreadGroup", "\"\"", "limits[3].spreadGroup: \"\" is not a non-empty string")]
    [InlineData("uppr", "1", "limits[3].uppr: unknown property (value 1); remove it or use one of: id, scope, scopeId, spreadGroup,")]
    [InlineData("id", "\"firm-dv01\"", "limits[3].id: \"firm-dv01\" is already the id of limits[0]")]
    public void A_bad_value_is_reported_with_path_value_and_fix(string property, string json, string expected)
    {
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(WithLimitProperty(3, property, json)));
        var error = Assert.Single(e.Errors);
        Assert.StartsWith(expected, error, StringComparison.Ordinal);
        Assert.Contains(expected, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_limit_on_an_unknown_book_is_an_error()
    {
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(WithLimitProperty(5, "scopeId", "\"govt-ultra\"")));
        Assert.Equal("limits[5].scopeId: \"govt-ultra\" is not a book listed under any desk; add it to a desk's books or fix the id", Assert.Single(e.Errors));
    }

    [Fact]
    public void No_bound_is_an_error()
    {
        var root = JsonNode.Parse(Example())!;
        root["limits"]![4]!.AsObject().Remove("upper");
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(root.ToJsonString()));
        Assert.StartsWith("limits[4].upper: missing (and no lower bound either)", Assert.Single(e.Errors), StringComparison.Ordinal);
    }

    [Fact]
    public void A_bad_default_is_reported_once_at_its_own_path()
    {
        var root = JsonNode.Parse(Example())!;
        root["defaults"]!["warning"] = 1.5;
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(root.ToJsonString()));
        Assert.StartsWith("defaults.warning: 1.5 is above 1", Assert.Single(e.Errors), StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_warning_without_default_is_reported()
    {
        var root = JsonNode.Parse(Example())!;
        root.AsObject().Remove("defaults");
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(root.ToJsonString()));
        Assert.Contains("limits[0].warning: missing; give a fraction such as 0.8 here or in defaults.warning", e.Errors);
        Assert.Contains("limits[4].hysteresis: missing; give a fraction such as 0.05 here or in defaults.hysteresis", e.Errors);
        Assert.DoesNotContain(e.Errors, m => m.StartsWith("limits[3].warning", StringComparison.Ordinal)); // limit 3 gives its own
    }

    [Fact]
    public void A_book_under_two_desks_is_reported_with_both_paths()
    {
        var root = JsonNode.Parse(Example())!;
        root["desks"]![1]!["books"]!.AsArray().Add("govt-long");
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(root.ToJsonString()));
        Assert.StartsWith("desks[1].books[2]: \"govt-long\" is already listed at desks[0].books[1]", Assert.Single(e.Errors), StringComparison.Ordinal);
    }

    [Fact]
    public void Several_problems_are_reported_together()
    {
        var root = JsonNode.Parse(Example())!;
        root["limits"]![0]!["warning"] = 2;
        root["limits"]![1]!["measure"] = "value";
        root.AsObject().Remove("firm");
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(root.ToJsonString()));
        Assert.Equal(3, e.Errors.Count);
        Assert.Contains(e.Errors, m => m.StartsWith("firm: missing", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("{ \"firm\": ", "(file): malformed JSON at line 1")]
    [InlineData("[]", "(root): [] is not a JSON object")]
    [InlineData("{ \"schemaVersion\": 2, \"firm\": \"f\", \"desks\": [], \"limits\": [] }", "schemaVersion: 2 is not supported")]
    public void Malformed_or_foreign_content_is_named(string json, string expected)
    {
        var e = Assert.Throws<LimitConfigurationException>(() => LimitsFileParser.Parse(json));
        Assert.StartsWith(expected, e.Errors[0], StringComparison.Ordinal);
    }

    [Fact]
    public void Comments_and_trailing_commas_are_accepted()
    {
        var config = LimitsFileParser.Parse("""
            // desk limits for the demo
            { "firm": "f", "desks": [ { "id": "d", "books": ["b",], }, ],
              "limits": [ { "id": "x", "scope": "firm", "measure": "convexity", "upper": 5, "warning": 1, "hysteresis": 0 } ] }
            """);
        Assert.Equal(ExposureMeasure.Convexity, Assert.Single(config.Limits).Measure);
    }

    private static string WithLimitProperty(int index, string property, string json)
    {
        var root = JsonNode.Parse(Example())!;
        root["limits"]![index]![property] = JsonNode.Parse(json);
        return root.ToJsonString();
    }
}
