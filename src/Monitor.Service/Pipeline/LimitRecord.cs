using System.Globalization;
using Monitor.Limits;

namespace Monitor.Service.Pipeline;

/// <summary>A limit definition as the exposure log records it: the limits file's own field names and values.</summary>
internal static class LimitRecord
{
    public static Dictionary<string, object?> Of(LimitDefinition limit) => new()
    {
        ["id"] = limit.Id,
        ["scope"] = limit.Scope.Level.ToString().ToLowerInvariant(),
        ["scopeId"] = limit.Scope.Id,
        ["spreadGroup"] = limit.SpreadGroup,
        ["measure"] = LimitsFileParser.JsonName(limit.Measure),
        ["lower"] = limit.Lower,
        ["upper"] = limit.Upper,
        ["warning"] = limit.WarningFraction,
        ["hysteresis"] = limit.HysteresisFraction,
        ["expiresAt"] = limit.ExpiresAt?.ToString("O", CultureInfo.InvariantCulture),
    };

    public static Dictionary<string, object?> Of(LimitModification modification) => new()
    {
        ["before"] = Of(modification.Before),
        ["after"] = Of(modification.After),
    };
}
