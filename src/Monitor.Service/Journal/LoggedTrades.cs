using System.Text.Json;
using Monitor.Service.Audit;

namespace Monitor.Service.Journal;

/// <summary>
/// The (trade id, version) pairs that already have a <c>trade-applied</c> record in the exposure log. A crash between
/// the journal's fsync and the log write leaves a durable trade without its audit record; start-up uses this to
/// write the missing records, so the log stays a complete account of every trade applied.
/// </summary>
public static class LoggedTrades
{
    public static HashSet<(string TradeId, int Version)> Read(string exposureLogFolder)
    {
        var keys = new HashSet<(string, int)>();
        foreach (var (_, path) in ExposureLogFiles.List(exposureLogFolder))
        {
            ReadFile(path, keys);
        }
        return keys;
    }

    /// <summary>The trade-applied records of one business day's file (none when the file does not exist).</summary>
    public static HashSet<(string TradeId, int Version)> ReadDay(string exposureLogFolder, DateOnly day)
    {
        var keys = new HashSet<(string, int)>();
        var path = ExposureLogFiles.PathOf(exposureLogFolder, day);
        if (File.Exists(path))
        {
            ReadFile(path, keys);
        }
        return keys;
    }

    /// <summary>The trade-applied records of the business days <paramref name="firstDay"/> to <paramref name="lastDay"/> (files that exist).</summary>
    public static HashSet<(string TradeId, int Version)> ReadDays(string exposureLogFolder, DateOnly firstDay, DateOnly lastDay)
    {
        var keys = new HashSet<(string, int)>();
        foreach (var (day, path) in ExposureLogFiles.List(exposureLogFolder))
        {
            if (day >= firstDay && day <= lastDay)
            {
                ReadFile(path, keys);
            }
        }
        return keys;
    }

    private static void ReadFile(string path, HashSet<(string, int)> keys)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
        using var reader = new StreamReader(stream);
        while (reader.ReadLine() is { } line)
        {
            if (!line.Contains("\"kind\":\"trade-applied\"", StringComparison.Ordinal))
            {
                continue;
            }
            try
            {
                using var document = JsonDocument.Parse(line);
                var payload = document.RootElement.GetProperty("payload");
                keys.Add((payload.GetProperty("tradeId").GetString()!, payload.GetProperty("version").GetInt32()));
            }
            catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException)
            {
                // A torn or foreign line is the verifier's business, not this lookup's.
            }
        }
    }
}
