namespace Monitor.Cli.Output;

/// <summary>
/// JSON of <c>monitor bond</c>: the bond, settlement, yield convention, what was given (<c>from</c>: "yield" or
/// "price"), and the measures per 100 face: yield in percent (compounded at the coupon frequency), prices, durations
/// in years, convexity in years squared, DV01 = dirty price gain for a 1 bp yield fall (exact repricing).
/// </summary>
internal sealed record BondView(
    string Id,
    double CouponPct,
    string MaturityDate,
    int Frequency,
    string DayCount,
    string IssueDate,
    string SettlementDate,
    string Convention,
    string From,
    double YieldPct,
    double CleanPrice,
    double AccruedInterest,
    double DirtyPrice,
    double MacaulayDuration,
    double ModifiedDuration,
    double Convexity,
    double Dv01);
