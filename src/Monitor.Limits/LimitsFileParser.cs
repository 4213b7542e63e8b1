using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace Monitor.Limits;

/// <summary>
/// Reads our limits file format (JSON; schema in this project's README.md) from its text or a stream
/// the caller opened. No file access here: the service reads the file, this class checks the content.
/// Every problem is reported at once, each naming the JSON path, the value and the fix, e.g.
/// "limits[3].warning: 1.2 is above 1; use a fraction such as 0.8; the warning level cannot be above the hard limit".
/// </summary>
public static partial class LimitsFileParser
{
    /// <summary>The schema version this parser reads.</summary>
    public const int SchemaVersion = 1;

    private static readonly JsonDocumentOptions DocumentOptions = new()
    {
        AllowTrailingCommas = true,
        CommentHandling = JsonCommentHandling.Skip,
    };

    private static readonly string[] RootProperties = ["schemaVersion", "firm", "defaults", "desks", "limits"];
    private static readonly string[] DefaultsProperties = ["warning", "hysteresis"];
    private static readonly string[] DeskProperties = ["id", "books"];
    private static readonly string[] LimitProperties = ["id", "scope", "scopeId", "spreadGroup", "measure", "lower", "upper", "warning", "hysteresis", "expiresAt", "note"];

    private static readonly Dictionary<string, string> JsonNameOfField = new(StringComparer.Ordinal)
    {
        [nameof(LimitDefinition.Id)] = "id",
        [nameof(LimitDefinition.Scope)] = "scopeId",
        [nameof(LimitDefinition.Measure)] = "measure",
        [nameof(LimitDefinition.SpreadGroup)] = "spreadGroup",
        [nameof(LimitDefinition.Lower)] = "lower",
        [nameof(LimitDefinition.Upper)] = "upper",
        [nameof(LimitDefinition.WarningFraction)] = "warning",
        [nameof(LimitDefinition.HysteresisFraction)] = "hysteresis",
        [nameof(LimitDefinition.ExpiresAt)] = "expiresAt",
    };

    /// <summary>Measure names as written in the file: the enum names in camelCase.</summary>
    public static string JsonName(ExposureMeasure measure)
    {
        var name = measure.ToString();
        return char.ToLowerInvariant(name[0]) + name[1..];
    }

    /// <exception cref="LimitConfigurationException">Malformed JSON or any schema, value or reference problem; lists them all.</exception>
    public static LimitsConfiguration Parse(string json)
    {
        ArgumentNullException.ThrowIfNull(json);
        try
        {
            using var document = JsonDocument.Parse(json, DocumentOptions);
            return Read(document.RootElement);
        }
        catch (JsonException e)
        {
            throw Malformed(e);
        }
    }

    /// <summary>Reads the content of a stream the caller opened (and disposes).</summary>
    /// <exception cref="LimitConfigurationException">As <see cref="Parse(string)"/>.</exception>
    public static LimitsConfiguration Parse(Stream content)
    {
        ArgumentNullException.ThrowIfNull(content);
        try
        {
            using var document = JsonDocument.Parse(content, DocumentOptions);
            return Read(document.RootElement);
        }
        catch (JsonException e)
        {
            throw Malformed(e);
        }
    }

    private static LimitConfigurationException Malformed(JsonException e) =>
        new([string.Create(CultureInfo.InvariantCulture,
            $"(file): malformed JSON at line {(e.LineNumber ?? 0) + 1}, byte {(e.BytePositionInLine ?? 0) + 1}: {e.Message}; fix the syntax (a JSON object with firm, desks and limits)")]);

    private static LimitsConfiguration Read(JsonElement root)
    {
        var errors = new List<string>();
        if (root.ValueKind != JsonValueKind.Object)
        {
            throw new LimitConfigurationException([$"(root): {Show(root)} is not a JSON object; the file must be an object with firm, desks and limits"]);
        }

        CheckProperties(root, "", RootProperties, errors);
        if (root.TryGetProperty("schemaVersion", out var version)
            && !(version.ValueKind == JsonValueKind.Number && version.TryGetInt32(out var v) && v == SchemaVersion))
        {
            errors.Add($"schemaVersion: {Show(version)} is not supported; this build reads schemaVersion {SchemaVersion}");
        }

        var firm = ReadString(root, "firm", "firm", errors, required: true, example: "\"demo-firm\"");
        var (defaultWarning, defaultHysteresis) = ReadDefaults(root, errors);
        var booksByDesk = ReadDesks(root, errors);
        var limits = ReadLimits(root, firm, booksByDesk, defaultWarning, defaultHysteresis, errors);

        if (errors.Count > 0)
        {
            throw new LimitConfigurationException(errors);
        }

        var hierarchy = new BookHierarchy(firm!, booksByDesk.ToDictionary(kv => kv.Key, kv => (IReadOnlyList<string>)kv.Value, StringComparer.Ordinal));
        return new LimitsConfiguration(hierarchy, limits);
    }

    private static (double? Warning, double? Hysteresis) ReadDefaults(JsonElement root, List<string> errors)
    {
        if (!root.TryGetProperty("defaults", out var defaults))
        {
            return (null, null);
        }

        if (defaults.ValueKind != JsonValueKind.Object)
        {
            errors.Add($"defaults: {Show(defaults)} is not an object; write {{ \"warning\": 0.8, \"hysteresis\": 0.05 }}");
            return (null, null);
        }

        CheckProperties(defaults, "defaults", DefaultsProperties, errors);
        var warning = ReadNumber(defaults, "warning", "defaults.warning", errors, "0.8");
        var hysteresis = ReadNumber(defaults, "hysteresis", "defaults.hysteresis", errors, "0.05");
        return (warning, hysteresis);
    }

    private static Dictionary<string, List<string>> ReadDesks(JsonElement root, List<string> errors)
    {
        var booksByDesk = new Dictionary<string, List<string>>(StringComparer.Ordinal);
        if (!root.TryGetProperty("desks", out var desks))
        {
            errors.Add("desks: missing; list the desks and their books, e.g. [ { \"id\": \"rates\", \"books\": [\"govt-short\"] } ]");
            return booksByDesk;
        }

        if (desks.ValueKind != JsonValueKind.Array)
        {
            errors.Add($"desks: {Show(desks)} is not an array; write [ {{ \"id\": \"rates\", \"books\": [\"govt-short\"] }} ]");
            return booksByDesk;
        }

        var deskPathById = new Dictionary<string, string>(StringComparer.Ordinal);
        var bookPathById = new Dictionary<string, string>(StringComparer.Ordinal);
        var i = 0;
        foreach (var desk in desks.EnumerateArray())
        {
            var path = $"desks[{i++}]";
            if (desk.ValueKind != JsonValueKind.Object)
            {
                errors.Add($"{path}: {Show(desk)} is not an object; write {{ \"id\": \"rates\", \"books\": [\"govt-short\"] }}");
                continue;
            }

            CheckProperties(desk, path, DeskProperties, errors);
            var id = ReadString(desk, "id", path + ".id", errors, required: true, example: "\"rates\"");
            if (id is not null && !deskPathById.TryAdd(id, path))
            {
                errors.Add($"{path}.id: \"{id}\" is already the id of {deskPathById[id]}; give each desk its own id or merge their books");
                id = null;
            }

            var books = new List<string>();
            if (!desk.TryGetProperty("books", out var bookArray))
            {
                errors.Add($"{path}.books: missing; list the desk's book ids, e.g. [\"govt-short\"], or [] for none yet");
            }
            else if (bookArray.ValueKind != JsonValueKind.Array)
            {
                errors.Add($"{path}.books: {Show(bookArray)} is not an array; write the book ids as [\"govt-short\", \"govt-long\"]");
            }
            else
            {
                var j = 0;
                foreach (var book in bookArray.EnumerateArray())
                {
                    var bookPath = $"{path}.books[{j++}]";
                    if (book.ValueKind != JsonValueKind.String || string.IsNullOrWhiteSpace(book.GetString()))
                    {
                        errors.Add($"{bookPath}: {Show(book)} is not a book id; give a non-empty string such as \"govt-short\"");
                        continue;
                    }

                    var bookId = book.GetString()!;
                    if (!bookPathById.TryAdd(bookId, bookPath))
                    {
                        errors.Add($"{bookPath}: \"{bookId}\" is already listed at {bookPathById[bookId]}; a book belongs to one desk, remove one of them");
                        continue;
                    }

                    books.Add(bookId);
                }
            }

            if (id is not null)
            {
                booksByDesk[id] = books;
            }
        }

        return booksByDesk;
    }

    private static List<LimitDefinition> ReadLimits(JsonElement root, string? firm, Dictionary<string, List<string>> booksByDesk,
        double? defaultWarning, double? defaultHysteresis, List<string> errors)
    {
        var result = new List<LimitDefinition>();
        if (!root.TryGetProperty("limits", out var limits))
        {
            errors.Add("limits: missing; list the limits, or write [] for none");
            return result;
        }

        if (limits.ValueKind != JsonValueKind.Array)
        {
            errors.Add($"limits: {Show(limits)} is not an array; write [ {{ \"id\": ..., \"scope\": ..., \"measure\": ..., \"upper\": ... }} ]");
            return result;
        }

        var books = booksByDesk.Values.SelectMany(b => b).ToHashSet(StringComparer.Ordinal);
        var limitPathById = new Dictionary<string, string>(StringComparer.Ordinal);
        var reported = new HashSet<string>(StringComparer.Ordinal);
        var i = 0;
        foreach (var limit in limits.EnumerateArray())
        {
            var path = $"limits[{i++}]";
            if (limit.ValueKind != JsonValueKind.Object)
            {
                errors.Add($"{path}: {Show(limit)} is not an object; write {{ \"id\": ..., \"scope\": ..., \"measure\": ..., \"upper\": ... }}");
                continue;
            }

            var before = errors.Count;
            CheckProperties(limit, path, LimitProperties, errors);
            var id = ReadString(limit, "id", path + ".id", errors, required: true, example: "\"desk-rates-dv01\"");
            if (id is not null && !limitPathById.TryAdd(id, path))
            {
                errors.Add($"{path}.id: \"{id}\" is already the id of {limitPathById[id]}; give each limit its own id");
            }

            var scope = ReadScope(limit, path, firm, booksByDesk, books, errors);
            var measure = ReadMeasure(limit, path, errors);
            var spreadGroup = ReadString(limit, "spreadGroup", path + ".spreadGroup", errors, required: false, example: "\"corp-a\"");
            var lower = ReadNumber(limit, "lower", path + ".lower", errors, "-250000");
            var upper = ReadNumber(limit, "upper", path + ".upper", errors, "250000");
            var warning = ReadNumber(limit, "warning", path + ".warning", errors, "0.8");
            var hysteresis = ReadNumber(limit, "hysteresis", path + ".hysteresis", errors, "0.05");
            var expiresAt = ReadInstant(limit, "expiresAt", path + ".expiresAt", errors);
            if (warning is null && defaultWarning is null && !limit.TryGetProperty("warning", out _))
            {
                errors.Add($"{path}.warning: missing; give a fraction such as 0.8 here or in defaults.warning");
            }

            if (hysteresis is null && defaultHysteresis is null && !limit.TryGetProperty("hysteresis", out _))
            {
                errors.Add($"{path}.hysteresis: missing; give a fraction such as 0.05 here or in defaults.hysteresis");
            }

            if (errors.Count > before || id is null || scope is null || measure is null)
            {
                continue;
            }

            var definition = new LimitDefinition
            {
                Id = id,
                Scope = scope.Value,
                Measure = measure.Value,
                SpreadGroup = spreadGroup,
                Lower = lower,
                Upper = upper,
                WarningFraction = warning ?? defaultWarning ?? double.NaN,
                HysteresisFraction = hysteresis ?? defaultHysteresis ?? double.NaN,
                ExpiresAt = expiresAt,
            };
            foreach (var error in definition.Validate())
            {
                var fromDefaults = (error.Field == nameof(LimitDefinition.WarningFraction) && warning is null)
                    || (error.Field == nameof(LimitDefinition.HysteresisFraction) && hysteresis is null);
                var fieldPath = fromDefaults ? "defaults." + JsonNameOfField[error.Field] : $"{path}.{JsonNameOfField[error.Field]}";
                var message = $"{fieldPath}: {error.Value} {error.Problem}; {error.Fix}";
                if (reported.Add(message))
                {
                    errors.Add(message);
                }
            }

            result.Add(definition);
        }

        return result;
    }

    private static LimitScope? ReadScope(JsonElement limit, string path, string? firm, Dictionary<string, List<string>> booksByDesk,
        HashSet<string> books, List<string> errors)
    {
        var level = ReadString(limit, "scope", path + ".scope", errors, required: true, example: "\"desk\"");
        var scopeId = ReadString(limit, "scopeId", path + ".scopeId", errors, required: false, example: "\"rates\"");
        switch (level?.ToLowerInvariant())
        {
            case null:
                return null;
            case "firm":
                if (scopeId is not null && firm is not null && scopeId != firm)
                {
                    errors.Add($"{path}.scopeId: \"{scopeId}\" is not the firm \"{firm}\"; leave scopeId out for a firm limit or write the firm's id");
                    return null;
                }

                // A missing firm is reported at "firm"; keep checking the limit's other fields.
                return LimitScope.Firm(firm ?? "(missing firm)");
            case "desk":
                if (scopeId is null)
                {
                    errors.Add($"{path}.scopeId: missing; name the desk, one of: {string.Join(", ", booksByDesk.Keys)}");
                    return null;
                }

                if (!booksByDesk.ContainsKey(scopeId))
                {
                    errors.Add($"{path}.scopeId: \"{scopeId}\" is not a desk listed in desks; add it to desks or use one of: {string.Join(", ", booksByDesk.Keys)}");
                    return null;
                }

                return LimitScope.Desk(scopeId);
            case "book":
                if (scopeId is null)
                {
                    errors.Add($"{path}.scopeId: missing; name the book the limit applies to");
                    return null;
                }

                if (!books.Contains(scopeId))
                {
                    errors.Add($"{path}.scopeId: \"{scopeId}\" is not a book listed under any desk; add it to a desk's books or fix the id");
                    return null;
                }

                return LimitScope.Book(scopeId);
            default:
                errors.Add($"{path}.scope: \"{level}\" is not a scope; use \"firm\", \"desk\" or \"book\"");
                return null;
        }
    }

    private static ExposureMeasure? ReadMeasure(JsonElement limit, string path, List<string> errors)
    {
        var text = ReadString(limit, "measure", path + ".measure", errors, required: true, example: "\"dv01\"");
        if (text is null)
        {
            return null;
        }

        foreach (var measure in Enum.GetValues<ExposureMeasure>())
        {
            if (string.Equals(JsonName(measure), text, StringComparison.OrdinalIgnoreCase))
            {
                return measure;
            }
        }

        errors.Add($"{path}.measure: \"{text}\" is not a measure; use one of: {string.Join(", ", Enum.GetValues<ExposureMeasure>().Select(JsonName))}");
        return null;
    }

    private static string? ReadString(JsonElement parent, string name, string path, List<string> errors, bool required, string example)
    {
        if (!parent.TryGetProperty(name, out var value) || value.ValueKind == JsonValueKind.Null)
        {
            if (required)
            {
                errors.Add($"{path}: missing; give a value such as {example}");
            }

            return null;
        }

        if (value.ValueKind != JsonValueKind.String || string.IsNullOrWhiteSpace(value.GetString()))
        {
            errors.Add($"{path}: {Show(value)} is not a non-empty string; write it as {example}");
            return null;
        }

        return value.GetString();
    }

    private static double? ReadNumber(JsonElement parent, string name, string path, List<string> errors, string example)
    {
        if (!parent.TryGetProperty(name, out var value) || value.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        if (value.ValueKind != JsonValueKind.Number || !value.TryGetDouble(out var number) || !double.IsFinite(number))
        {
            errors.Add($"{path}: {Show(value)} is not a number; write a plain JSON number such as {example}");
            return null;
        }

        return number;
    }

    private static DateTimeOffset? ReadInstant(JsonElement parent, string name, string path, List<string> errors)
    {
        if (!parent.TryGetProperty(name, out var value) || value.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        // Trap: without an offset the parser would assume the machine's time zone; demand one.
        if (value.ValueKind != JsonValueKind.String
            || !ExplicitOffset().IsMatch(value.GetString()!)
            || !value.TryGetDateTimeOffset(out var instant))
        {
            errors.Add($"{path}: {Show(value)} is not an ISO 8601 time with an offset; write it as \"2026-12-01T17:00:00Z\" or \"2026-12-01T18:00:00+01:00\"");
            return null;
        }

        return instant;
    }

    private static void CheckProperties(JsonElement element, string path, string[] known, List<string> errors)
    {
        foreach (var property in element.EnumerateObject())
        {
            if (!known.Contains(property.Name, StringComparer.Ordinal))
            {
                var at = path.Length == 0 ? property.Name : $"{path}.{property.Name}";
                errors.Add($"{at}: unknown property (value {Show(property.Value)}); remove it or use one of: {string.Join(", ", known)}");
            }
        }
    }

    /// <summary>The value as it appears in the file, shortened.</summary>
    private static string Show(JsonElement value)
    {
        var text = value.GetRawText();
        return text.Length <= 60 ? text : text[..57] + "...";
    }

    [GeneratedRegex(@"T.*(Z|[+-]\d{2}:\d{2})$", RegexOptions.CultureInvariant)]
    private static partial Regex ExplicitOffset();
}
