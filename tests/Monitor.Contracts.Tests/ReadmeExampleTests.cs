using System.Text.Json.Nodes;

namespace Monitor.Contracts.Tests;

// The README shows one example per message under a "### <TypeName>" heading; each must equal
// Data/<TypeName>.json, so the documentation cannot drift from the examples the round-trip test checks.
public class ReadmeExampleTests
{
    private static readonly string Readme = File.ReadAllText(JsonExamples.DataPath("Monitor.Contracts.README.md"));

    public static TheoryData<string> Messages() => new(JsonExamples.Messages);

    [Theory]
    [MemberData(nameof(Messages))]
    public void Readme_example_equals_the_data_file(string message)
    {
        var heading = Readme.IndexOf($"\n### {message}\n", StringComparison.Ordinal);
        Assert.True(heading >= 0, $"README has no '### {message}' heading");
        var start = Readme.IndexOf("```json\n", heading, StringComparison.Ordinal) + "```json\n".Length;
        var end = Readme.IndexOf("\n```", start, StringComparison.Ordinal);
        var example = JsonNode.Parse(Readme[start..end]);
        Assert.True(JsonNode.DeepEquals(example, JsonNode.Parse(JsonExamples.Read(message))), $"README example of {message} differs from Data/{message}.json");
    }
}
