using System.Text.Json;
using System.Text.Json.Serialization;

namespace Monitor.Contracts.Tests;

/// <summary>The example files in Data/ and the serializer settings the README promises.</summary>
internal static class JsonExamples
{
    /// <summary>The messages that have an example: every top-level message of V1.</summary>
    public static readonly string[] Messages =
    [
        "InstrumentDefined", "BondQuoted", "ParYieldsPublished", "TradeBooked",
        "CurveFitted", "CurveRejected", "BookExposuresBatch", "BookExposuresUpdated", "LimitStatusChanged",
        "LimitsReloadFlagged",
        "ExposureLogCheckpointed",
    ];

    /// <summary>Web defaults (camelCase, case-insensitive read), strict about unknown and null-for-non-nullable fields.</summary>
    public static readonly JsonSerializerOptions Strict = new(JsonSerializerDefaults.Web)
    {
        UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
        RespectNullableAnnotations = true,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
    };

    public static string DataPath(string name) => Path.Combine(AppContext.BaseDirectory, "Data", name);

    public static string Read(string message) => File.ReadAllText(DataPath(message + ".json"));

    public static Type TypeOf(string message) =>
        ContractSurface.Assembly.GetType("Monitor.Contracts.V1." + message, throwOnError: true)!;
}
