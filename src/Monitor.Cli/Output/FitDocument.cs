namespace Monitor.Cli.Output;

/// <summary>
/// JSON of <c>monitor fit</c>: the valuation date (quotes) or as-of date (par yields), the year basis of the curve's
/// time (the tenors' years), and the fitted curves, government first.
/// </summary>
internal sealed record FitDocument(string Date, string YearBasis, IReadOnlyList<CurveView> Curves);
