namespace Monitor.Analytics.Fitting;

/// <summary>
/// Residual of one instrument against the fitted curve, in basis points of yield:
/// market yield minus model yield, approximated for bonds by (model price - market price) / (price * duration)
/// (positive = the instrument is cheap to the curve). For par-yield fits: published minus model par yield.
/// <see cref="Used"/> is false for instruments the fitter excluded as outliers.
/// </summary>
public readonly record struct FitResidual(string Id, double ResidualBp, bool Used);
