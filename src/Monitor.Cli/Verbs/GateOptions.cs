using System.CommandLine;
using System.Globalization;
using Monitor.Analytics.Fitting;
using Monitor.Service.Engine;

namespace Monitor.Cli.Verbs;

/// <summary>
/// The quality-gate options of one curve kind (base or spread): maximum RMSE and largest residual in bp, minimum
/// instruments. Defaults are the service's (<see cref="EngineSettings.BaseGate"/>, <see cref="EngineSettings.SpreadGate"/>).
/// </summary>
internal sealed class GateOptions
{
    private readonly FitQualityGate _defaults;

    private GateOptions(string prefix, string curve, FitQualityGate defaults)
    {
        _defaults = defaults;
        MaxRmse = new Option<double?>($"--{prefix}max-rmse-bp") { Description = Inv($"Quality gate of the {curve}: largest RMSE in bp of yield (default {defaults.MaxRmseBp}).") };
        MaxError = new Option<double?>($"--{prefix}max-error-bp") { Description = Inv($"Quality gate of the {curve}: largest absolute residual in bp (default {defaults.MaxAbsErrorBp}).") };
        MinInstruments = new Option<int?>($"--{prefix}min-instruments") { Description = Inv($"Quality gate of the {curve}: fewest instruments used (default {defaults.MinInstruments}).") };
    }

    public Option<double?> MaxRmse { get; }

    public Option<double?> MaxError { get; }

    public Option<int?> MinInstruments { get; }

    /// <summary>--max-rmse-bp, --max-error-bp, --min-instruments for the government (or par-yield) curve.</summary>
    public static GateOptions ForBase() => new(string.Empty, "government curve", Defaults().BaseGate);

    /// <summary>--spread-max-rmse-bp, ... for spread curves.</summary>
    public static GateOptions ForSpread() => new("spread-", "spread curves", Defaults().SpreadGate);

    public void AddTo(Command command)
    {
        command.Options.Add(MaxRmse);
        command.Options.Add(MaxError);
        command.Options.Add(MinInstruments);
    }

    public FitQualityGate Read(ParseResult parse)
    {
        var rmse = parse.GetValue(MaxRmse) ?? _defaults.MaxRmseBp;
        var error = parse.GetValue(MaxError) ?? _defaults.MaxAbsErrorBp;
        var count = parse.GetValue(MinInstruments) ?? _defaults.MinInstruments;
        Positive(MaxRmse.Name, rmse);
        Positive(MaxError.Name, error);
        if (count < 1)
        {
            throw CliInputException.Option(MinInstruments.Name, count.ToString(CultureInfo.InvariantCulture), "must be at least 1.");
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
