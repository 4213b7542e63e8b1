using System.CommandLine;
using Monitor.Analytics.Fitting;
using Monitor.Cli.Output;
using Monitor.Files;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor fit</c>: fits the government curve to bond quotes (and with --spread-group that group's spread curve over
/// it), or a curve to par-yield points; prints parameters, fit report, residuals, quotes left out and the gate verdict.
/// Exit 0 when every curve passes its gate, 4 when one fails, 1 bad option, 2 bad file.
/// </summary>
internal static class FitVerb
{
    public static Command Create()
    {
        var instruments = CommonOptions.File("--instruments", "(required unless --par-yields) Instruments file (config/examples/README.md).", required: false);
        var quotes = CommonOptions.File("--quotes", "(required unless --par-yields) Quotes file; the newest quote per instrument is used.", required: false);
        var model = CommonOptions.Model();
        var valuationDate = CommonOptions.Date("--valuation-date", "Valuation date YYYY-MM-DD (default: the spot date, T+1 business day, of the earliest quote's date).");
        var spreadGroup = new Option<string?>("--spread-group") { Description = "Also fit this spread group's Nelson-Siegel spread curve over the government curve." };
        var parYields = CommonOptions.File("--par-yields", "Par-yield points file: fit a curve to one date's points instead of bond quotes.", required: false);
        var asOf = CommonOptions.Date("--as-of", "With --par-yields: the date to fit (default: the only date in the file).");
        var stale = CommonOptions.StaleAfterHours();
        var tenors = CommonOptions.Tenors(CurveViews.StandardTenors);
        var json = CommonOptions.Json();
        var baseGate = GateOptions.ForBase();
        var spreadGate = GateOptions.ForSpread();
        var parGate = GateOptions.ForParYields();
        var command = new Command("fit", "Fit the government curve (and a spread curve) to bond quotes, or a curve to par yields; print parameters, fit report, the curve at --tenors with its year basis, residuals in bp, quotes left out and the quality-gate verdict. Exit 4 when a curve fails its gate.");
        foreach (var option in new Option[] { instruments, quotes, model, valuationDate, spreadGroup, parYields, asOf, tenors, stale, json })
        {
            command.Options.Add(option);
        }
        baseGate.AddTo(command);
        spreadGate.AddTo(command);
        parGate.AddTo(command);
        command.SetAction(parse => VerbRunner.Run(parse, output =>
        {
            var curveModel = CommonOptions.ParseModel(parse.GetValue(model));
            var years = CommonOptions.ParseTenors(parse.GetValue(tenors), CurveViews.StandardTenors);
            var views = parse.GetValue(parYields) is { } parPath
                ? FitParYields(parPath, CommonOptions.ParseDate("--as-of", parse.GetValue(asOf)), curveModel, parGate.Read(parse), parse.GetValue(quotes), years)
                : FitQuotes(
                    parse.GetValue(instruments) ?? throw CliInputException.Missing("--instruments", "the instruments file (config/examples/README.md), or give --par-yields."),
                    parse.GetValue(quotes) ?? throw CliInputException.Missing("--quotes", "the quotes file (config/examples/README.md), or give --par-yields."),
                    CommonOptions.ParseDate("--valuation-date", parse.GetValue(valuationDate)),
                    parse.GetValue(spreadGroup),
                    curveModel,
                    baseGate.Read(parse),
                    spreadGate.Read(parse),
                    CommonOptions.ParseStaleAfter(parse.GetValue(stale)),
                    years);
            if (parse.GetValue(json))
            {
                JsonOutput.Write(output, views);
            }
            else
            {
                var console = TableConsole.Create(output);
                TableConsole.Line(console, (parse.GetValue(parYields) is null ? "valuation date " : "par yields as of ") + views.Date);
                TableConsole.Line(console, "curve time: " + views.YearBasis);
                foreach (var curve in views.Curves)
                {
                    CurveTables.Write(console, curve);
                }
            }
            return views.Curves.All(c => c.Gate.Passed) ? 0 : VerbRunner.GateFailed;
        }));
        return command;
    }

    private static FitDocument FitQuotes(
        string instrumentsPath, string quotesPath, DateOnly? valuationDate, string? spreadGroup, CurveModel model,
        FitQualityGate baseGate, FitQualityGate spreadGate, TimeSpan staleAfter, IReadOnlyList<double> tenors)
    {
        var bonds = InstrumentFile.Read(instrumentsPath).ToDictionary(b => b.Id, StringComparer.Ordinal);
        if (spreadGroup is not null && !bonds.Values.Any(b => string.Equals(b.SpreadGroup, spreadGroup, StringComparison.Ordinal)))
        {
            throw CliInputException.Option("--spread-group", spreadGroup, $"is not the spread group of any bond in {instrumentsPath}.");
        }
        var snapshot = MarketSnapshot.Load(bonds, quotesPath, valuationDate, staleAfter);
        var curves = snapshot.Fit(model, baseGate, spreadGate, spreadGroup is null ? [] : [spreadGroup]);
        var date = Num.Date(snapshot.ValuationDate);
        return new FitDocument(date, $"ACT/365F years from the valuation date {date}", [.. curves.All().Select(c => CurveViews.Of(c, tenors))]);
    }

    private static FitDocument FitParYields(string path, DateOnly? asOf, CurveModel model, FitQualityGate gate, string? quotes, IReadOnlyList<double> tenors)
    {
        if (quotes is not null)
        {
            throw CliInputException.Option("--quotes", quotes, "cannot be combined with --par-yields: fit either bond quotes or par yields.");
        }
        var sets = ParYieldFile.Read(path);
        if (sets.Count == 0)
        {
            throw new CliInputException($"{path}: holds no par yields.");
        }
        ParYieldSet set;
        if (asOf is { } date)
        {
            set = sets.FirstOrDefault(s => s.AsOf == date)
                ?? throw CliInputException.Option("--as-of", Num.Date(date), $"is not a date in {path} (it holds {string.Join(", ", sets.Select(s => Num.Date(s.AsOf)))}).");
        }
        else
        {
            set = sets.Count == 1
                ? sets[0]
                : throw CliInputException.Option("--as-of", null, $"is required: {path} holds {sets.Count} dates ({string.Join(", ", sets.Select(s => Num.Date(s.AsOf)))}).");
        }
        var points = set.Points.Select(p => new Analytics.Fitting.ParYieldPoint(p.TenorYears, p.ParYield)).ToArray();
        CurveFitResult result;
        try
        {
            result = new ParYieldCurveFitter().Fit(points, new CurveFitOptions { Model = model });
        }
        catch (ArgumentException ex)
        {
            throw new CliInputException($"par-yield curve of {Num.Date(set.AsOf)} from {path}: {ex.Message}", ex);
        }
        var published = set.Points.Where(p => p.ParYield.HasValue).ToDictionary(p => ParYieldCurveFitter.TenorLabel(p.TenorYears), p => p.ParYield!.Value, StringComparer.Ordinal);
        var blank = set.Points.Where(p => !p.ParYield.HasValue).Select(p => ParYieldCurveFitter.TenorLabel(p.TenorYears)).ToArray();
        return new FitDocument(Num.Date(set.AsOf), "years of the tenor labels (1M = 1/12, 10Y = 10)",
            [CurveViews.OfParYields(result, gate, gate.Evaluate(result.Report), published, blank, tenors)]);
    }
}
