using System.CommandLine;
using System.Globalization;
using Monitor.Analytics.Fitting;
using Monitor.Service.Engine;

namespace Monitor.Cli.Verbs;

/// <summary>
/// The quality-gate options of one curve kind (base, spread, par yields): maximum RMSE and largest residual in bp,
/// fewest quotes used. Names are the service's configuration keys in kebab case (Monitor:BaseMinQuotes is
/// --base-min-quotes; DEVELOPERS.md, Conventions). Bond-fit defaults are the service's (<see cref="EngineSettings.BaseGate"/>,
/// <see cref="EngineSettings.SpreadGate"/>); par-yield fits have their own (<see cref="ParYieldDefaults"/>).
/// </summary>
internal sealed class GateOptions
{
    private readonly FitQualityGate _defaults;

    /// <summary>
    /// Gate of a fit to published par yields: constant-maturity par yields are not points of one smooth curve, so a
    /// Nelson-Siegel fit to them misses by more than a fit to bond prices does (measured on four published US Treasury
    /// dates: RMSE 2.2 to 9.0 bp, tests/Monitor.Analytics.Tests/Fitting/TreasuryParYieldFitTests); 10 bp RMSE, 30 bp
    /// largest miss and 6 points (two more than Nelson-Siegel's 4 parameters) pass those and refuse a fit stuck in a
    /// wrong basin (tens of bp). Common practice, no published source for the thresholds.
    /// </summary>
    public static readonly FitQualityGate ParYieldDefaults = new(MaxRmseBp: 10, MaxAbsErrorBp: 30, MinInstruments: 6);

    private GateOptions(string prefix, string curve, string quotes, FitQualityGate defaults)
    {
        _defaults = defaults;
        MaxRmse = new Option<double?>($"--{prefix}-max-rmse-bp") { Description = Inv($"Quality gate of the {curve}: largest RMSE in bp of yield (default {defaults.MaxRmseBp}).") };
        MaxError = new Option<double?>($"--{prefix}-max-error-bp") { Description = Inv($"Quality gate of the {curve}: largest absolute residual in bp (default {defaults.MaxAbsErrorBp}).") };
        MinQuotes = new Option<int?>($"--{prefix}-min-quotes") { Description = Inv($"Quality gate of the {curve}: fewest {quotes} used (default {defaults.MinInstruments}).") };
    }

    public Option<double?> MaxRmse { get; }

    public Option<double?> MaxError { get; }

    public Option<int?> MinQuotes { get; }

    /// <summary>--base-max-rmse-bp, --base-max-error-bp, --base-min-quotes for the government curve (Monitor:BaseMaxRmseBp, ...).</summary>
    public static GateOptions ForBase() => new("base", "government curve", "bond quotes", Defaults().BaseGate);

    /// <summary>--spread-max-rmse-bp, ... for spread curves (Monitor:SpreadMaxRmseBp, ...).</summary>
    public static GateOptions ForSpread() => new("spread", "spread curves", "bond quotes", Defaults().SpreadGate);

    /// <summary>--par-max-rmse-bp, --par-max-error-bp, --par-min-quotes for a fit to par yields.</summary>
    public static GateOptions ForParYields() => new("par", "par-yield fit", "par-yield points", ParYieldDefaults);

    public void AddTo(Command command)
    {
        command.Options.Add(MaxRmse);
        command.Options.Add(MaxError);
        command.Options.Add(MinQuotes);
    }

    public FitQualityGate Read(ParseResult parse)
    {
        var rmse = parse.GetValue(MaxRmse) ?? _defaults.MaxRmseBp;
        var error = parse.GetValue(MaxError) ?? _defaults.MaxAbsErrorBp;
        var count = parse.GetValue(MinQuotes) ?? _defaults.MinInstruments;
        Positive(MaxRmse.Name, rmse);
        Positive(MaxError.Name, error);
        if (count < 1)
        {
            throw CliInputException.Option(MinQuotes.Name, count.ToString(CultureInfo.InvariantCulture), "must be at least 1.");
        }
        return _defaults with { MaxRmseBp = rmse, MaxAbsErrorBp = error, MinInstruments = count };
    }

    private static void Positive(string option, double value)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw CliInputException.Option(option, value.ToString("G", CultureInfo.InvariantCulture), "must be a positive number of basis points.");
        }
    }

    private static EngineSettings Defaults() => new() { ValuationDate = DateOnly.MinValue };

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
