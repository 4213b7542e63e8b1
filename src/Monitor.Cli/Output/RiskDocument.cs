namespace Monitor.Cli.Output;

/// <summary>JSON of <c>monitor risk</c>: valuation date, curves used, positions (omitted with --by book) and books.</summary>
internal sealed record RiskDocument(string ValuationDate, IReadOnlyList<CurveView> Curves, IReadOnlyList<PositionView>? Positions, IReadOnlyList<BookView> Books);
