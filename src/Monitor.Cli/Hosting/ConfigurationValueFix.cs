using System.Globalization;
using System.Text.RegularExpressions;
using Microsoft.Extensions.Configuration;

namespace Monitor.Cli.Hosting;

/// <summary>
/// The configuration binder's "Failed to convert configuration value at 'ExposureLog:FlushToDisk' to type
/// 'System.Boolean'" as a line naming the key, the value and the fix ("use true or false").
/// </summary>
internal static partial class ConfigurationValueFix
{
    /// <summary>The line for a binder conversion failure, or null when <paramref name="exception"/> is not one.</summary>
    public static string? Describe(InvalidOperationException exception, IConfiguration? configuration)
    {
        ArgumentNullException.ThrowIfNull(exception);
        var match = Conversion().Match(exception.Message);
        if (!match.Success)
        {
            return null;
        }
        var key = match.Groups["key"].Value;
        var type = match.Groups["type"].Value;
        var value = configuration?[key];
        return $"{key}: '{value}' is not {Expected(type)}.";
    }

    private static string Expected(string typeName)
    {
        // The binder names the type without its assembly: look in the loaded ones (the options types are loaded by then).
        var type = Type.GetType(typeName) ?? AppDomain.CurrentDomain.GetAssemblies().Select(a => a.GetType(typeName)).FirstOrDefault(t => t is not null);
        var t = type is null ? null : Nullable.GetUnderlyingType(type) ?? type;
        return t switch
        {
            null => $"a value of type {typeName}; see config/README.md for the key",
            _ when t == typeof(bool) => "a yes/no value; use true or false",
            _ when t == typeof(int) || t == typeof(long) => "a whole number; use digits only, e.g. 6",
            _ when t == typeof(double) || t == typeof(decimal) => "a number; use a decimal point, e.g. 5 or 2.5",
            _ when t == typeof(TimeSpan) => "a duration; use hh:mm:ss, e.g. 00:00:10 for ten seconds",
            _ when t == typeof(DateOnly) => "a date; use yyyy-MM-dd, e.g. 2026-06-02",
            _ when t.IsEnum => $"one of {string.Join(", ", Enum.GetNames(t))}",
            _ => string.Create(CultureInfo.InvariantCulture, $"a {t.Name}; see config/README.md for the key"),
        };
    }

    [GeneratedRegex(@"Failed to convert configuration value (?:'[^']*' )?at '(?<key>[^']+)' to type '(?<type>[^']+)'")]
    private static partial Regex Conversion();
}
