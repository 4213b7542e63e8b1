namespace Monitor.Cli.Output;

/// <summary>
/// JSON: one quote offered to a fit: maturity, clean price per 100, yield in percent, residual in bp of yield
/// (market minus model; positive = cheap to the curve), and whether the fit used it (false = outlier).
/// </summary>
internal sealed record ResidualView(string Id, string? Maturity, double? CleanPrice, double? YieldPct, double ResidualBp, bool Used);
