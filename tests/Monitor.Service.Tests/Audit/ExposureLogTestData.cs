using System.Text.Json;
using Microsoft.Extensions.Time.Testing;
using Monitor.Service.Audit;

namespace Monitor.Service.Tests.Audit;

/// <summary>Invented figures and a fixed clock for the exposure log tests.</summary>
internal static class ExposureLogTestData
{
    public static readonly DateTimeOffset Day1Morning = new(2026, 12, 1, 9, 0, 0, TimeSpan.Zero);

    public static FakeTimeProvider Clock() => new(Day1Morning);

    public static ExposureLogOptions Options(string folder) => new() { Folder = folder, FlushToDisk = false };

    public static ExposureLogCause Cause(int i) => new($"msg-{i}", "BondQuote");

    public static JsonElement Figures(int i) =>
        JsonSerializer.SerializeToElement(new { book = "RATES-1", dv01 = -1250.5 - i, value = 1_000_000.25 * i, status = "normal" });

    public static string[] Lines(string path) => File.ReadAllText(path).Split('\n', StringSplitOptions.RemoveEmptyEntries);

    public static void WriteLines(string path, IEnumerable<string> lines) => File.WriteAllText(path, string.Concat(lines.Select(l => l + "\n")));
}
