namespace Monitor.Analytics.Pricing;

/// <summary>
/// Yield-based measures of a bond at one settlement date, per 100 face. Yield is a decimal compounded at the coupon
/// frequency; durations in years; convexity in years^2.
/// </summary>
/// <param name="Yield">Yield to maturity (0.05 = 5%).</param>
/// <param name="CleanPrice">Dirty price minus accrued interest.</param>
/// <param name="AccruedInterest">Accrued interest at settlement.</param>
/// <param name="DirtyPrice">Present value of the cash flows after settlement.</param>
/// <param name="MacaulayDuration">sum(t_j PV_j) / P with t_j = (w + j)/f years.</param>
/// <param name="ModifiedDuration">-(1/P) dP/dy; equals Macaulay / (1 + y/f) when every flow is compounded.</param>
/// <param name="Convexity">(1/P) d2P/dy2.</param>
/// <param name="Dv01">Dirty price change for a 1 bp yield fall, P(y - 0.0001) - P(y), by exact repricing.</param>
public sealed record YieldMeasures(
    double Yield,
    double CleanPrice,
    double AccruedInterest,
    double DirtyPrice,
    double MacaulayDuration,
    double ModifiedDuration,
    double Convexity,
    double Dv01);
