using System.CommandLine;
using System.Globalization;
using Monitor.Analytics.Fitting;

namespace Monitor.Cli.Verbs;

/// <summary>Options several verbs share, and the parsing of their values into messages that name the option and value.</summary>
internal static class CommonOptions
{
    public const string NelsonSiegel = "nelson-siegel";
    public const string Svensson = "svensson";

    /// <summary>Marks required options in help ("(required)") and names a missing one with what it wants.</summary>
    public const string RequiredMark = "(required) ";

    public static Option<string> File(string name, string description, bool required) =>
        new(name) { Description = required ? RequiredMark + description : description };

    /// <summary>
    /// Every option of <paramref name="command"/> whose help starts with <see cref="RequiredMark"/> must be given; a
    /// missing one fails with "--name is required and missing; it wants: &lt;its help&gt;" (exit 1). System.CommandLine's own
    /// "Option '--x' is required." names the option but not what it wants.
    /// </summary>
    public static void CheckRequired(Command command)
    {
        var required = command.Options.Where(o => o.Description?.StartsWith(RequiredMark, StringComparison.Ordinal) == true).ToArray();
        command.Validators.Add(result =>
        {
            foreach (var option in required)
            {
                if (result.GetResult(option) is null)
                {
                    result.AddError($"{option.Name} is required and missing; it wants: {option.Description![RequiredMark.Length..]}");
                }
            }
        });
    }

    public static Option<bool> Json() =>
        new("--json") { Description = "Print JSON (camelCase, invariant numbers; shape in src/Monitor.Cli/README.md) instead of tables." };

    public static Option<string> Model()
    {
        var option = new Option<string>("--model")
        {
            Description = "Base curve model: nelson-siegel (b0, b1, b2, tau) or svensson (b0..b3, tau1, tau2). Spread curves are Nelson-Siegel.",
            DefaultValueFactory = _ => NelsonSiegel,
        };
        return OneOf(option, NelsonSiegel, Svensson);
    }

    /// <summary>
    /// Restricts an option to a few lowercase words (any case accepted; read it with <see cref="Word"/>), with an error
    /// that names the option and the value.
    /// </summary>
    public static Option<string> OneOf(Option<string> option, params string[] words)
    {
        option.HelpName = string.Join('|', words);
        option.Validators.Add(result =>
        {
            var value = result.GetValueOrDefault<string>();
            if (!words.Contains(value, StringComparer.OrdinalIgnoreCase))
            {
                result.AddError($"{option.Name}: '{value}' is not one of {string.Join(", ", words)}.");
            }
        });
        return option;
    }

    /// <summary>The value of a <see cref="OneOf"/> option in its lowercase spelling.</summary>
    public static string? Word(ParseResult parse, Option<string> option) => parse.GetValue(option)?.ToLowerInvariant();

    /// <summary>--tenors: years (1,2,5,10,30), a range of whole years (1..30), labels (3M, 2Y), or a mix.</summary>
    public static Option<string?> Tenors(string defaultText) =>
        new("--tenors")
        {
            Description = $"Tenors to print: years (1,2,5,10,30), a range of whole years (1..30), labels (3M, 2Y) or a mix (default {defaultText}).",
        };

    /// <summary>Parses --tenors into ascending distinct years.</summary>
    public static IReadOnlyList<double> ParseTenors(string? text, string defaultText) => TenorList.Parse("--tenors", text ?? defaultText);

    public static Option<string?> Date(string name, string description) => new(name) { Description = description };

    public static Option<double> StaleAfterHours() =>
        new("--stale-after-hours")
        {
            Description = "A quote older than this many hours before the newest quote in its file is left out as stale (default 4, as the service).",
            DefaultValueFactory = _ => 4.0,
        };

    public static CurveModel ParseModel(string? text) => text?.ToLowerInvariant() switch
    {
        Svensson => CurveModel.Svensson,
        _ => CurveModel.NelsonSiegel,
    };

    /// <summary>A YYYY-MM-DD option value, or null when the option was not given.</summary>
    public static DateOnly? ParseDate(string option, string? text)
    {
        if (text is null)
        {
            return null;
        }
        return DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date)
            ? date
            : throw CliInputException.Option(option, text, "is not a date in the form YYYY-MM-DD.");
    }

    public static TimeSpan ParseStaleAfter(double hours) =>
        double.IsFinite(hours) && hours > 0
            ? TimeSpan.FromHours(hours)
            : throw CliInputException.Option("--stale-after-hours", hours.ToString("G", CultureInfo.InvariantCulture), "must be a positive number of hours.");
}
