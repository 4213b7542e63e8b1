using System.Collections;
using System.Reflection;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace Monitor.Service.Messaging;

/// <summary>
/// Turns a System.Text.Json failure on an inbound body into a <see cref="MessageRejectedException"/> that names the wire
/// field (the JSON path without <c>$.</c>) and says in words what the field must hold. The reader's own sentence
/// ("could not be converted to System.Double", "LineNumber: 0 | BytePositionInLine: 57") never reaches the reason.
/// </summary>
public static partial class JsonRefusal
{
    /// <summary>The field named when the body as a whole is not a JSON object (no path inside it).</summary>
    public const string BodyField = "body";

    /// <param name="exception">The reader's or the deserializer's exception.</param>
    /// <param name="contract">The message type the body was read as.</param>
    /// <param name="body">The body text, to quote the offending value when it can be found; null when unknown.</param>
    public static MessageRejectedException From(JsonException exception, Type contract, string? body)
    {
        ArgumentNullException.ThrowIfNull(exception);
        ArgumentNullException.ThrowIfNull(contract);
        var missing = MissingMembers().Match(exception.Message);
        if (missing.Success)
        {
            // "missing required properties including: 'tradeId', 'book'." names wire names already.
            var names = QuotedName().Matches(missing.Groups["names"].Value).Select(m => m.Groups["name"].Value).ToArray();
            var field = names.Length > 0 ? names[0] : BodyField;
            return new MessageRejectedException(field, null,
                names.Length > 1 ? $"is missing (required; also missing: {string.Join(", ", names[1..])})." : "is missing (required).");
        }
        var rawPath = exception.Path is { Length: > 1 } p && p.StartsWith("$.", StringComparison.Ordinal) ? p[2..] : null;
        // A reader error while the whole body was parsed first (MassTransit's plain JSON) has no path: find the field by reading again.
        rawPath ??= exception.Message.Contains("LineNumber", StringComparison.Ordinal) ? FieldAtReaderError(body) : null;
        if (rawPath is null)
        {
            return new MessageRejectedException(BodyField, null, exception.Message.Contains("LineNumber", StringComparison.Ordinal)
                ? "is not valid JSON (cut off, or not one object); send one object such as {\"instrumentId\": ...}."
                : "is not a JSON object of this message's fields; send one object such as {\"instrumentId\": ...}.");
        }
        // A value of the wrong type ("could not be converted") or a reader error (an invalid token such as NaN or a cut-off body).
        var syntax = !exception.Message.StartsWith("The JSON value could not be converted", StringComparison.Ordinal)
            && exception.Message.Contains("LineNumber", StringComparison.Ordinal);
        var (target, path) = MemberType(contract, rawPath);
        var value = syntax ? null : ValueAt(body, rawPath);
        if (syntax)
        {
            return new MessageRejectedException(path, null,
                $"is not valid JSON at this field ({Expectation(target)}; NaN, Infinity and unquoted words are not JSON values).");
        }
        return new MessageRejectedException(path, value, target is null ? "is not expected here." : Expectation(target) + ".");
    }

    /// <summary>What a field of <paramref name="type"/> must hold, in words.</summary>
    private static string Expectation(Type? type)
    {
        var t = type is null ? null : Nullable.GetUnderlyingType(type) ?? type;
        return t switch
        {
            null => "must be a value of this message's fields",
            _ when t == typeof(double) || t == typeof(decimal) || t == typeof(float) => "must be a number, e.g. 99.5",
            _ when t == typeof(int) || t == typeof(long) => "must be a whole number, e.g. 2",
            _ when t == typeof(string) => "must be a string in quotes",
            _ when t == typeof(DateTimeOffset) || t == typeof(DateTime) => "must be an ISO 8601 time with its offset in quotes, e.g. \"2026-06-02T10:15:00Z\"",
            _ when t == typeof(DateOnly) => "must be an ISO 8601 date in quotes, e.g. \"2026-06-02\"",
            _ when t == typeof(bool) => "must be true or false",
            _ when t != typeof(string) && typeof(IEnumerable).IsAssignableFrom(t) => "must be an array",
            _ => "must be an object",
        };
    }

    /// <summary>
    /// The declared type at a path such as <c>points[0].parYield</c> (null when the path leaves the contract) and the path
    /// in the contract's camelCase spelling (a producer may have sent <c>FaceAmount</c>; the field is <c>faceAmount</c>).
    /// </summary>
    private static (Type? Type, string Path) MemberType(Type contract, string path)
    {
        Type? current = contract;
        var segments = path.Split('.');
        for (var i = 0; i < segments.Length; i++)
        {
            var name = segments[i];
            var indexed = name.IndexOf('[', StringComparison.Ordinal);
            var index = indexed >= 0 ? name[indexed..] : "";
            if (indexed >= 0)
            {
                name = name[..indexed];
            }
            var property = current?.GetProperty(name, BindingFlags.Public | BindingFlags.Instance | BindingFlags.IgnoreCase);
            if (property is not null)
            {
                segments[i] = JsonNamingPolicy.CamelCase.ConvertName(property.Name) + index;
            }
            current = property?.PropertyType;
            if (indexed >= 0 && current is not null)
            {
                current = current.IsArray ? current.GetElementType() : current.GetGenericArguments().FirstOrDefault();
            }
        }
        return (current, string.Join('.', segments));
    }

    /// <summary>The raw JSON text at <paramref name="path"/> (clipped), or null when the body cannot be read there.</summary>
    private static string? ValueAt(string? body, string path)
    {
        if (body is null)
        {
            return null;
        }
        try
        {
            using var document = JsonDocument.Parse(body);
            var element = document.RootElement;
            foreach (var segment in path.Split('.'))
            {
                var name = segment;
                var index = -1;
                var bracket = name.IndexOf('[', StringComparison.Ordinal);
                if (bracket >= 0)
                {
                    _ = int.TryParse(name[(bracket + 1)..^1], System.Globalization.CultureInfo.InvariantCulture, out index);
                    name = name[..bracket];
                }
                if (element.ValueKind != JsonValueKind.Object || !TryGetProperty(element, name, out element))
                {
                    return null;
                }
                if (index >= 0)
                {
                    if (element.ValueKind != JsonValueKind.Array || index >= element.GetArrayLength())
                    {
                        return null;
                    }
                    element = element[index];
                }
            }
            var text = element.GetRawText();
            return text.Length > 40 ? text[..40] + "..." : text;
        }
        catch (JsonException)
        {
            return null;
        }
    }

    /// <summary>The top-level property whose value the reader failed on, or null (cut off between fields, not an object).</summary>
    private static string? FieldAtReaderError(string? body)
    {
        if (body is null)
        {
            return null;
        }
        var reader = new Utf8JsonReader(System.Text.Encoding.UTF8.GetBytes(body));
        string? property = null;
        try
        {
            while (reader.Read())
            {
                if (reader.TokenType == JsonTokenType.PropertyName && reader.CurrentDepth == 1)
                {
                    property = reader.GetString();
                }
                else if (reader.CurrentDepth == 1 && reader.TokenType != JsonTokenType.StartObject && reader.TokenType != JsonTokenType.StartArray)
                {
                    property = null; // that field's value was read whole
                }
            }
            return null;
        }
        catch (JsonException)
        {
            return property;
        }
    }

    private static bool TryGetProperty(JsonElement element, string name, out JsonElement value)
    {
        foreach (var property in element.EnumerateObject())
        {
            if (string.Equals(property.Name, name, StringComparison.OrdinalIgnoreCase))
            {
                value = property.Value;
                return true;
            }
        }
        value = default;
        return false;
    }

    [GeneratedRegex(@"missing required properties[^:]*:\s*(?<names>.*)$", RegexOptions.Singleline)]
    private static partial Regex MissingMembers();

    [GeneratedRegex(@"'(?<name>[^']+)'")]
    private static partial Regex QuotedName();
}
