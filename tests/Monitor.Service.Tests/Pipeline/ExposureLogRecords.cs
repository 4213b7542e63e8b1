using System.Text.Json.Nodes;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>The exposure log's records as JSON (every line of every day file in a folder), for tests that read what was recorded.</summary>
internal static class ExposureLogRecords
{
    public static IReadOnlyList<JsonNode> Of(string folder, string kind) =>
        Directory.EnumerateFiles(folder, "*.jsonl").Order(StringComparer.Ordinal)
            .SelectMany(File.ReadLines)
            .Where(l => l.Length > 0)
            .Select(l => JsonNode.Parse(l)!)
            .Where(r => (string?)r["kind"] == kind)
            .ToArray();
}
