using System.Text.Json;
using Monitor.Service.Audit;

namespace Monitor.Service.Journal;

/// <summary>
/// The last published version of every curve, from the exposure log's <c>curve-fitted</c> records (curve label -&gt;
/// highest version). A restarted service continues each curve from there, so versions only grow across restarts and a
/// consumer ordering fits by version never takes a new curve for an old one. The log is the durable record of every
/// published fit (written before the event leaves), so no fit can have a version it does not hold.
/// </summary>
public static class LoggedCurveVersions
{
    public static Dictionary<string, int> Read(string exposureLogFolder)
    {
        var versions = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var (_, path) in ExposureLogFiles.List(exposureLogFolder))
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
            using var reader = new StreamReader(stream);
            while (reader.ReadLine() is { } line)
            {
                if (!line.Contains("\"kind\":\"curve-fitted\"", StringComparison.Ordinal))
                {
                    continue;
                }
                try
                {
                    using var document = JsonDocument.Parse(line);
                    var payload = document.RootElement.GetProperty("payload");
                    var curve = payload.GetProperty("curve").GetString()!;
                    var version = payload.GetProperty("version").GetInt32();
                    versions[curve] = Math.Max(version, versions.GetValueOrDefault(curve));
                }
                catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException or FormatException)
                {
                    // A torn or foreign line is the verifier's business, not this lookup's.
                }
            }
        }
        return versions;
    }
}
