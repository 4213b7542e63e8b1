namespace Monitor.Analytics.Fitting;

/// <summary>
/// One quoted instrument as the fitters see it: its remaining cash flows, already computed by the caller.
/// <see cref="Times"/> are curve times in years (ACT/365F from the valuation date, see
/// <see cref="Curves.CurveTime"/>); <see cref="Amounts"/> are per 100 face, coupons and redemption;
/// <see cref="DirtyPrice"/> is per 100 face (clean + accrued). <see cref="Duration"/> (years, e.g. the
/// modified duration at the quoted yield) only weights the price error: price error / (P D) is close
/// to the yield error, so the fit's residuals read as yield errors. Flows at t &lt;= 0 are ignored.
/// </summary>
public sealed record FitInstrument(string Id, double[] Times, double[] Amounts, double DirtyPrice, double Duration);
