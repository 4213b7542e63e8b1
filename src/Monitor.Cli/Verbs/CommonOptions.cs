using System.CommandLine;
using System.Globalization;
using Monitor.Analytics.Fitting;

namespace Monitor.Cli.Verbs;

/// <summary>Options several verbs share, and the parsing of their values into messages that name the option and value.</summary>
internal static class CommonOptions
{
    public const string NelsonSiegel = "nelson-siegel";
    public const string Svensson = "svensson";

    public static Option<string> File(string name, string description, bool required) =>
        new(name) { Description = description, Required = required };

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

    /// <summary>Restricts an option to a few words, with an error that names the option and the value.</summary>
    public static Option<string> OneOf(Option<string> option, params string[] words)
    {
        option.HelpName = string.Join('|', words);
        option.Validators.Add(result =>
        {
            var value = result.GetValueOrDefault<string>();
            if (!words.Contains(value, StringComparer.Ordinal))
            {
                result.AddError($"{option.Name}: '{value}' is not one of {string.Join(", ", words)}.");
            }
        });
        return option;
    }

    public static Option<string?> Date(string name, string description) => new(name) { Description = description };

    public static Option<double> StaleAfterHours() =>
        new("--stale-after-hours")
        {
            Description = "A quote older than this many hours before the newest quote in its file is left out as stale (default 4, as the service).",
            DefaultValueFactory = _ => 4.0,
        };

    public static CurveModel ParseModel(string? text) => text switch
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
