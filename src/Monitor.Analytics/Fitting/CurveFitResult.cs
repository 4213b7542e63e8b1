using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// A fitted curve, its parameters (in the curve's ToArray order, decimals and years) and the fit report.
/// For a spread fit <see cref="Curve"/> is the spread curve s(m) alone; combine it with the base
/// through <see cref="SpreadedCurve"/>.
/// </summary>
public sealed record CurveFitResult(IFactorCurve Curve, double[] Parameters, FitReport Report);
