namespace Monitor.Analytics.Pricing;

/// <summary>
/// How a yield discounts a bond's cash flows. Yields are decimals compounded at the coupon frequency f
/// (semiannual, "bond-equivalent", for a zero-coupon bond). w = f x (day-count year fraction from settlement to the
/// next coupon date), the fractional first period in coupon periods; later flows sit at w + 1, w + 2, ...
/// </summary>
public enum YieldConvention
{
    /// <summary>
    /// Street convention: compounded, v^(w + k) with v = 1/(1 + y/f); when only the final coupon remains, simple
    /// interest P = CF / (1 + w y / f) (for w &lt;= 1; SIA Standard Securities Calculation Methods, the "6 months or less to
    /// maturity" formula as printed in the HP 12C manual, App. "Formulas Used"; the same as 31 CFR 356 App. B, II
    /// with n = 0). A zero-coupon bond within half a year of maturity is likewise priced with simple interest.
    /// </summary>
    Street,

    /// <summary>Always compounded, v^(w + k), also in the final period (QLNet/QuantLib Compounded + frequency).</summary>
    Compounded,

    /// <summary>
    /// US Treasury auction formula (31 CFR 356, App. B, II): the fraction of a period up to the next (quasi-)coupon
    /// date is discounted with simple interest, 1 / (1 + (r/s) y / f), the remaining whole periods compounded (in a
    /// long first period one whole period sits between the quasi-coupon date and the first coupon).
    /// </summary>
    TreasuryAuction,
}
