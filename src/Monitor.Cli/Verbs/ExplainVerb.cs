using System.CommandLine;
using Monitor.Analytics.Attribution;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Risk;
using Monitor.Cli.Output;
using Monitor.Files;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor explain</c>: fits the curves of two snapshots and decomposes each book's holding-period return
/// (<see cref="ReturnDecomposition"/>): horizon, base curve, spread and interaction (adding up exactly to ln(V1/V0)),
/// and each curve move's factor duration, convexity and cross-convexity terms, decay change and residual.
/// </summary>
internal static class ExplainVerb
{
    public static Command Create()
    {
        var instruments = CommonOptions.File("--instruments", "Instruments file.", required: true);
        var positions = CommonOptions.File("--positions", "Positions file, held over the whole period.", required: true);
        var fromQuotes = CommonOptions.File("--from-quotes", "Quotes at the start of the period.", required: true);
        var toQuotes = CommonOptions.File("--to-quotes", "Quotes at the end of the period.", required: true);
        var fromDate = CommonOptions.Date("--from-date", "Start valuation date YYYY-MM-DD (default: the spot date of the earliest from-quote's date).");
        var toDate = CommonOptions.Date("--to-date", "End valuation date YYYY-MM-DD, on or after --from-date (default: the spot date of the earliest to-quote's date).");
        var model = CommonOptions.Model();
        var stale = CommonOptions.StaleAfterHours();
        var json = CommonOptions.Json();
        var baseGate = GateOptions.ForBase();
        var spreadGate = GateOptions.ForSpread();
        var command = new Command("explain", "Explain each book's return between two market snapshots: horizon (carry and roll-down), base curve, spread and interaction, with factor duration, convexity and cross-convexity terms and the residual; money and bp.");
        foreach (var option in new Option[] { instruments, positions, fromQuotes, toQuotes, fromDate, toDate, model, stale, json })
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
            var staleAfter = CommonOptions.ParseStaleAfter(parse.GetValue(stale));
            var t0 = CommonOptions.ParseDate("--from-date", parse.GetValue(fromDate));
            var t1 = CommonOptions.ParseDate("--to-date", parse.GetValue(toDate));
            var from = MarketSnapshot.Load(bonds, parse.GetValue(fromQuotes)!, t0, staleAfter);
            var to = MarketSnapshot.Load(bonds, parse.GetValue(toQuotes)!, t1, staleAfter);
            if (to.ValuationDate < from.ValuationDate)
            {
                throw CliInputException.Option("--to-date", Num.Date(to.ValuationDate), $"is before the start date {Num.Date(from.ValuationDate)}.");
            }
            var curveModel = CommonOptions.ParseModel(parse.GetValue(model));
            var (bg, sg) = (baseGate.Read(parse), spreadGate.Read(parse));
            var document = Compute(book, from.Fit(curveModel, bg, sg, book.SpreadGroups), to.Fit(curveModel, bg, sg, book.SpreadGroups));
            if (parse.GetValue(json))
            {
                JsonOutput.Write(output, document);
            }
            else
            {
                ExplainTables.Write(TableConsole.Create(output), document);
            }
            return 0;
        }));
        return command;
    }

    public static ExplainDocument Compute(BookPositions book, CurveSet from, CurveSet to)
    {
        var t0 = from.ValuationDate;
        var t1 = to.ValuationDate;
        var spreads0 = from.SpreadCurves();
        var spreads1 = to.SpreadCurves();
        var books = new List<BookExplainView>();
        foreach (var (id, ledger) in book.Ledgers(t0))
        {
            ReturnDecompositionResult r;
            try
            {
                r = ReturnDecomposition.Decompose(ledger, t0, t1, from.Base, to.Base, spreads0, spreads1);
            }
            catch (ArgumentException ex)
            {
                throw new CliInputException($"book '{id}': {ex.Message}", ex);
            }
            books.Add(new BookExplainView(
                id, r.V0, r.Vh, r.Vb, r.Vs, r.V1, r.ReceivedCash, r.TotalPnl, 1e4 * r.TotalReturn,
                [.. r.Contributions.Select(Contribution)],
                Curve(r.BaseExplanation, from.Base.FactorNames, null),
                r.SpreadExplanation is { } s
                    ? Curve(s, new NelsonSiegelCurve(0.01, 0, 0, 1).FactorNames, ledger.CurveKeys.First(k => !CurveKey.IsGovernment(k)))
                    : null));
        }
        return new ExplainDocument(Num.Date(t0), Num.Date(t1), [.. from.All().Select(CurveViews.Of)], [.. to.All().Select(CurveViews.Of)], books);
    }

    private static ContributionView Contribution(ReturnContribution c) => new(c.Name, c.Money, 1e4 * c.Return);

    private static CurveExplainView Curve(CurveReturnExplanation e, IReadOnlyList<string> names, string? movesOf)
    {
        var moves = new Dictionary<string, double>(StringComparer.Ordinal);
        for (var k = 0; k < e.FactorMoves.Count && k < names.Count; k++)
        {
            moves[names[k]] = 1e4 * e.FactorMoves[k];
        }
        return new CurveExplainView(Contribution(e.Actual), movesOf, moves, [.. e.Terms.Select(Contribution)], Contribution(e.Shape), Contribution(e.Residual));
    }
}
