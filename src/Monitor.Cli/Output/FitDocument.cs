namespace Monitor.Cli.Output;

/// <summary>JSON of <c>monitor fit</c>: the valuation date (quotes) or as-of date (par yields) and the fitted curves, government first.</summary>
internal sealed record FitDocument(string Date, IReadOnlyList<CurveView> Curves);
