using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;
using Monitor.Service.Storage;

namespace Monitor.Cli.Hosting;

/// <summary>
/// Turns a start-up failure caused by bad configuration into plain lines for stderr (each naming the key and the fix).
/// Options are validated on start (<c>ValidateOnStart</c>), so these arrive as <see cref="OptionsValidationException"/>,
/// sometimes wrapped in an <see cref="AggregateException"/> when several hosted services fail.
/// </summary>
internal static class StartupFailure
{
    /// <summary>The validation messages inside <paramref name="exception"/>, or none when it is not a configuration problem.</summary>
    public static IReadOnlyList<string> ConfigurationProblems(Exception exception, IConfiguration? configuration)
    {
        var found = new List<string>();
        Collect(exception, found, configuration);
        return found.Distinct(StringComparer.Ordinal).ToArray();
    }

    /// <summary>The refused writer lock inside <paramref name="exception"/> (another instance writes the folder), or null.</summary>
    public static FolderInUseException? FolderInUse(Exception exception) => exception switch
    {
        FolderInUseException inUse => inUse,
        AggregateException aggregate => aggregate.InnerExceptions.Select(FolderInUse).FirstOrDefault(e => e is not null),
        _ => exception.InnerException is { } inner ? FolderInUse(inner) : null,
    };

    /// <summary>The journal or exposure-log refusal inside <paramref name="exception"/> (the start fails closed on a bad record), or null.</summary>
    public static Exception? RefusedRecord(Exception exception) => exception switch
    {
        Monitor.Service.Journal.JournalRejectedException or ExposureLogOpenException => exception,
        AggregateException aggregate => aggregate.InnerExceptions.Select(RefusedRecord).FirstOrDefault(e => e is not null),
        _ => exception.InnerException is { } inner ? RefusedRecord(inner) : null,
    };

    private static void Collect(Exception exception, List<string> found, IConfiguration? configuration)
    {
        switch (exception)
        {
            case OptionsValidationException validation:
                if (validation.OptionsType == typeof(ExposureLogOptions) && configuration is not null)
                {
                    // The service's ExposureLog check only says "see the messages logged"; give the messages themselves.
                    var options = configuration.GetSection(ExposureLogOptions.SectionName).Get<ExposureLogOptions>() ?? new ExposureLogOptions();
                    found.AddRange(options.Validate());
                }
                else
                {
                    found.AddRange(validation.Failures);
                }
                break;
            case InvalidOperationException conversion when ConfigurationValueFix.Describe(conversion, configuration) is { } problem:
                found.Add(problem);
                break;
            case AggregateException aggregate:
                foreach (var inner in aggregate.InnerExceptions)
                {
                    Collect(inner, found, configuration);
                }
                break;
            default:
                if (exception.InnerException is { } innerException)
                {
                    Collect(innerException, found, configuration);
                }
                break;
        }
    }
}
