namespace Monitor.Cli.Output;

/// <summary>JSON of <c>monitor explain</c>: the two valuation dates, the curves of each snapshot, and each book's return decomposition.</summary>
internal sealed record ExplainDocument(string FromDate, string ToDate, IReadOnlyList<CurveView> FromCurves, IReadOnlyList<CurveView> ToCurves, IReadOnlyList<BookExplainView> Books);
