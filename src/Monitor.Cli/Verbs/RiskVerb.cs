using System.CommandLine;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Risk;
using Monitor.Cli.Output;
using Monitor.Files;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor risk</c>: fits the government curve and the spread curve of each spread group held, then prints per
/// position and per book the dirty value, DV01, base and spread factor money per bp and unit durations, and level
/// convexity. Book figures come from the cash flows merged by date (<see cref="BookRiskCalculator"/>) and are shown
/// beside their gap to the sum of the positions (zero to rounding: exposures are linear in the cash flows).
/// </summary>
internal static class RiskVerb
{
    private static readonly IReadOnlyList<string> SpreadFactorNames = new NelsonSiegelCurve(0.01, 0, 0, 1).FactorNames;

    public static Command Create()
    {
        var instruments = CommonOptions.File("--instruments", "Instruments file.", required: true);
        var quotes = CommonOptions.File("--quotes", "Quotes file; the newest quote per instrument is used.", required: true);
        var positions = CommonOptions.File("--positions", "Positions file (book, instrument_id, signed face_amount).", required: true);
        var valuationDate = CommonOptions.Date("--valuation-date", "Valuation date YYYY-MM-DD (default: the spot date, T+1 business day, of the earliest quote's date).");
        var by = new Option<string>("--by") { Description = "position: positions and books; book: books only.", DefaultValueFactory = _ => "position" };
        CommonOptions.OneOf(by, "position", "book");
        var model = CommonOptions.Model();
        var stale = CommonOptions.StaleAfterHours();
        var json = CommonOptions.Json();
        var baseGate = GateOptions.ForBase();
        var spreadGate = GateOptions.ForSpread();
        var command = new Command("risk", "Position and book risk on curves fitted to the quotes: value, DV01, level/slope/curvature money per bp and durations (base and spread), level convexity. Book figures by cash-flow date aggregation, checked against the position sums.");
        foreach (var option in new Option[] { instruments, quotes, positions, valuationDate, by, model, stale, json })
        {
            command.Options.Add(option);
        }
        baseGate.AddTo(command);
        spreadGate.AddTo(command);
        CommonOptions.CheckRequired(command);
        command.SetAction(parse => VerbRunner.Run(parse, output =>
        {
            var bonds = InstrumentFile.Read(parse.GetValue(instruments)!).ToDictionary(b => b.Id, StringComparer.Ordinal);
            var book = BookPositions.Load(parse.GetValue(positions)!, bonds);
            var snapshot = MarketSnapshot.Load(bonds, parse.GetValue(quotes)!,
                CommonOptions.ParseDate("--valuation-date", parse.GetValue(valuationDate)), CommonOptions.ParseStaleAfter(parse.GetValue(stale)));
            var curves = snapshot.Fit(CommonOptions.ParseModel(parse.GetValue(model)), baseGate.Read(parse), spreadGate.Read(parse), book.SpreadGroups);
            var document = Compute(book, curves, CommonOptions.Word(parse, by) == "position");
            if (parse.GetValue(json))
            {
                JsonOutput.Write(output, document);
            }
            else
            {
                RiskTables.Write(TableConsole.Create(output), document);
            }
            return 0;
        }));
        return command;
    }

    public static RiskDocument Compute(BookPositions book, CurveSet curves, bool withPositions)
    {
        var date = curves.ValuationDate;
        var baseNames = curves.Base.FactorNames;
        var spreads = curves.SpreadCurves();
        var positionViews = new List<PositionView>();
        var sums = book.Books.ToDictionary(b => b, _ => FactorExposures.Zero(curves.Base.FactorCount, 0), StringComparer.Ordinal);
        foreach (var (record, bond) in book.Positions)
        {
            var spread = CurveKey.IsGovernment(bond.SpreadGroup) ? null : spreads[bond.SpreadGroup!];
            var exposures = PositionRisk.Compute(bond.CashFlowsAfter(date), date, curves.Base, spread, record.FaceAmount / 100.0);
            sums[record.Book] = sums[record.Book].Plus(exposures);
            positionViews.Add(new PositionView(record.Book, record.InstrumentId, bond.SpreadGroup, record.FaceAmount, ExposureViews.Of(exposures, baseNames, SpreadFactorNames)));
        }
        var ledgers = book.Ledgers(date);
        var bookViews = new List<BookView>();
        if (ledgers.Count > 0)
        {
            var grid = CurveGrid.Build(ledgers.Values.First().Dates, date, curves.Base, spreads);
            foreach (var (id, ledger) in ledgers)
            {
                var risk = BookRiskCalculator.Compute(ledger, grid);
                var aggregated = ExposureViews.Of(risk.Total, baseNames, SpreadFactorNames);
                var summed = ExposureViews.Of(sums[id], baseNames, SpreadFactorNames);
                bookViews.Add(new BookView(id, book.Positions.Count(p => p.Record.Book == id), aggregated, summed, ExposureViews.MaxAbsDifference(aggregated, summed)));
            }
        }
        return new RiskDocument(Num.Date(date), [.. curves.All().Select(CurveViews.Of)], withPositions ? positionViews : null, bookViews);
    }
}
