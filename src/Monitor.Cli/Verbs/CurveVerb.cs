using System.CommandLine;
using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Cli.Output;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor curve</c>: evaluates a Nelson-Siegel or Svensson curve from its parameters in the published convention
/// of Gurkaynak, Sack and Wright (2006) (betas in percent, decays in years, continuously compounded zero yields):
/// zero yield, par yield (semiannual, 200 (1 - P(n)) / sum P(k/2)) and instantaneous forward at tenors, so a
/// published curve can be reproduced. Svensson when --beta3 and --tau2 are given, Nelson-Siegel otherwise.
/// </summary>
internal static class CurveVerb
{
    private const string DefaultTenors = "1..30";

    public static Command Create()
    {
        var beta0 = Beta("--beta0", "level, the long-run zero yield");
        var beta1 = Beta("--beta1", "slope loading");
        var beta2 = Beta("--beta2", "first curvature (hump) loading");
        var beta3 = new Option<double?>("--beta3") { Description = "Svensson only: second curvature loading, percent (with --tau2)." };
        var tau1 = new Option<double?>("--tau1", "--tau") { Description = CommonOptions.RequiredMark + "First (Nelson-Siegel: the) decay, years." };
        var tau2 = new Option<double?>("--tau2") { Description = "Svensson only: second decay, years (with --beta3)." };
        var tenors = CommonOptions.Tenors(DefaultTenors);
        var json = CommonOptions.Json();
        var command = new Command("curve", "Evaluate a Nelson-Siegel or Svensson curve from published parameters (betas in percent, decays in years): zero yields, par yields and instantaneous forwards at tenors.");
        foreach (var option in new Option[] { beta0, beta1, beta2, beta3, tau1, tau2, tenors, json })
        {
            command.Options.Add(option);
        }
        CommonOptions.CheckRequired(command);
        command.SetAction(parse => VerbRunner.Run(parse, output =>
        {
            var (b3, t2) = (parse.GetValue(beta3), parse.GetValue(tau2));
            if (b3.HasValue != t2.HasValue)
            {
                throw CliInputException.Missing(b3.HasValue ? "--tau2" : "--beta3", "a Svensson curve takes both --beta3 (percent) and --tau2 (years); give neither for Nelson-Siegel.");
            }
            var view = Evaluate(
                parse.GetValue(beta0)!.Value, parse.GetValue(beta1)!.Value, parse.GetValue(beta2)!.Value, b3, parse.GetValue(tau1)!.Value, t2,
                CommonOptions.ParseTenors(parse.GetValue(tenors), DefaultTenors));
            if (parse.GetValue(json))
            {
                JsonOutput.Write(output, view);
            }
            else
            {
                CurveParameterTables.Write(TableConsole.Create(output), view);
            }
            return 0;
        }));
        return command;
    }

    public static CurveParameterView Evaluate(double beta0Pct, double beta1Pct, double beta2Pct, double? beta3Pct, double tau1, double? tau2, IReadOnlyList<double> tenors)
    {
        IZeroCurve curve;
        try
        {
            curve = beta3Pct is { } b3 && tau2 is { } t2
                ? new SvenssonCurve(beta0Pct / 100, beta1Pct / 100, beta2Pct / 100, b3 / 100, tau1, t2)
                : new NelsonSiegelCurve(beta0Pct / 100, beta1Pct / 100, beta2Pct / 100, tau1);
        }
        catch (ArgumentException ex)
        {
            var option = ex.ParamName is { } p ? "--" + p : "--tau1";
            throw CliInputException.Option(option, null, ex.Message.Split(" (Parameter", 2)[0]);
        }
        var svensson = curve is SvenssonCurve;
        var parameters = new Dictionary<string, double>(StringComparer.Ordinal)
        {
            ["beta0"] = beta0Pct,
            ["beta1"] = beta1Pct,
            ["beta2"] = beta2Pct,
        };
        if (svensson)
        {
            parameters["beta3"] = beta3Pct!.Value;
        }
        parameters["tau1"] = tau1;
        if (svensson)
        {
            parameters["tau2"] = tau2!.Value;
        }
        var points = tenors.Select(t => new CurveParameterPoint(
            ParYieldCurveFitter.TenorLabel(t), t, 100 * curve.ZeroRate(t), 100 * ParYield.Compute(curve, t, ParYieldCurveFitter.Frequency), 100 * curve.InstantaneousForward(t)));
        return new CurveParameterView(svensson ? CommonOptions.Svensson : CommonOptions.NelsonSiegel, parameters, [.. points]);
    }

    private static Option<double?> Beta(string name, string meaning) =>
        new(name) { Description = CommonOptions.RequiredMark + string.Create(CultureInfo.InvariantCulture, $"{meaning}, percent.") };
}
