using System.Text.Json;

namespace Monitor.Service.Audit;

/// <summary>Serialises a record's figures (a dictionary) into the JSON object the log stores, refusing what JSON cannot hold.</summary>
internal static class ExposureLogPayload
{
    public static readonly JsonSerializerOptions Json = new() { WriteIndented = false };

    /// <exception cref="ArgumentException">A value cannot be written as JSON (NaN, infinity, a cycle); <paramref name="what"/> names the record.</exception>
    public static JsonElement ToJson(IReadOnlyDictionary<string, object?> payload, string what)
    {
        ArgumentNullException.ThrowIfNull(payload);
        try
        {
            return JsonSerializer.SerializeToElement(payload, Json);
        }
        catch (Exception ex) when (ex is ArgumentException or JsonException or NotSupportedException or InvalidOperationException)
        {
            throw new ArgumentException($"{what} cannot be written as JSON: {ex.Message}", nameof(payload), ex);
        }
    }
}
