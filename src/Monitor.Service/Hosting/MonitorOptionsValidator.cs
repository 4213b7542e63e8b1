using System.Globalization;
using Microsoft.Extensions.Options;

namespace Monitor.Service.Hosting;

/// <summary>Checks the <c>Monitor</c> section at start-up; each failure names the key, the value and the fix.</summary>
public sealed class MonitorOptionsValidator : IValidateOptions<MonitorOptions>
{
    public ValidateOptionsResult Validate(string? name, MonitorOptions options)
    {
        var failures = new List<string>();
        RequireFile(failures, "Monitor:InstrumentsFile", options.InstrumentsFile, required: true);
        RequireFile(failures, "Monitor:LimitsFile", options.LimitsFile, required: true);
        RequireFile(failures, "Monitor:PositionsFile", options.PositionsFile, required: false);
        RequireFile(failures, "Monitor:OpeningQuotesFile", options.OpeningQuotesFile, required: false);
        failures.AddRange(options.BusinessDay.Validate());
        if (options.ReportingCurrency is null || options.ReportingCurrency.Length != 3 || !options.ReportingCurrency.All(char.IsAsciiLetterUpper))
        {
            failures.Add($"Monitor:ReportingCurrency: '{options.ReportingCurrency}' is not an ISO 4217 code; use three capital letters, e.g. EUR.");
        }
        if (!Enum.IsDefined(options.ValuationCurveSource))
        {
            failures.Add($"Monitor:ValuationCurveSource: '{options.ValuationCurveSource}' is not a source; use BondQuotes or ParYields.");
        }
        if (!Enum.IsDefined(options.BaseCurveModel))
        {
            failures.Add($"Monitor:BaseCurveModel: '{options.BaseCurveModel}' is not a model; use NelsonSiegel or Svensson.");
        }
        Range(failures, "Monitor:ConflationWindow", options.ConflationWindow, TimeSpan.Zero, TimeSpan.FromSeconds(10), "e.g. 00:00:00.020");
        Range(failures, "Monitor:BookEventInterval", options.BookEventInterval, TimeSpan.Zero, TimeSpan.FromMinutes(10), "e.g. 00:00:01, or 0 to send book figures after every change");
        Range(failures, "Monitor:SnapshotInterval", options.SnapshotInterval, TimeSpan.Zero, TimeSpan.FromDays(1), "e.g. 00:05:00, or 0 to turn snapshots off");
        Range(failures, "Monitor:QuoteClockTolerance", options.QuoteClockTolerance, TimeSpan.Zero, TimeSpan.FromMinutes(5), "e.g. 00:00:05");
        Range(failures, "Monitor:StaleQuoteAfter", options.StaleQuoteAfter, TimeSpan.FromSeconds(1), TimeSpan.FromDays(7), "e.g. 04:00:00");
        Positive(failures, "Monitor:BaseMaxRmseBp", options.BaseMaxRmseBp);
        Positive(failures, "Monitor:BaseMaxErrorBp", options.BaseMaxErrorBp);
        Positive(failures, "Monitor:SpreadMaxRmseBp", options.SpreadMaxRmseBp);
        Positive(failures, "Monitor:SpreadMaxErrorBp", options.SpreadMaxErrorBp);
        if (options.BaseMinQuotes < 4)
        {
            failures.Add($"Monitor:BaseMinQuotes: {options.BaseMinQuotes} is fewer than a curve has parameters; use 6 or more.");
        }
        if (options.SpreadMinQuotes < 4)
        {
            failures.Add($"Monitor:SpreadMinQuotes: {options.SpreadMinQuotes} is fewer than a spread curve has parameters; use 4 or more.");
        }
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }

    private static void RequireFile(List<string> failures, string key, string? path, bool required)
    {
        if (string.IsNullOrWhiteSpace(path))
        {
            if (required)
            {
                failures.Add($"{key}: is not set; give the path of the file.");
            }
            return;
        }
        if (Directory.Exists(path))
        {
            failures.Add($"{key}: '{path}' is a folder, not a file; give the path of the file itself.");
        }
        else if (!File.Exists(path))
        {
            failures.Add($"{key}: '{path}' does not exist; fix the path (relative paths start from {Environment.CurrentDirectory}).");
        }
    }

    private static void Range(List<string> failures, string key, TimeSpan value, TimeSpan min, TimeSpan max, string example)
    {
        if (value < min || value > max)
        {
            failures.Add($"{key}: {value.ToString("c", CultureInfo.InvariantCulture)} is outside {min:c}..{max:c}; {example}.");
        }
    }

    private static void Positive(List<string> failures, string key, double value)
    {
        if (!(value > 0) || !double.IsFinite(value))
        {
            failures.Add($"{key}: {value.ToString(CultureInfo.InvariantCulture)} must be a positive number of basis points.");
        }
    }
}
