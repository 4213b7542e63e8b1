namespace Monitor.Analytics.Curves;

/// <summary>
/// Par yield of a bond paying coupons f times a year up to the tenor:
/// par(T) = (1 - DF(T)) / A(T), A(T) = sum over coupon times of DF(t_k) times the period's year fraction.
/// Coupon times step back from T by 1/f; a remaining stub shorter than 1/f is a short first period
/// weighted by its length, so tenors under one period reduce to the simple-interest yield (1/DF(T) - 1)/T.
/// Quoted with compounding at the coupon frequency (bond-equivalent for f = 2): common practice, no source.
/// </summary>
public static class ParYield
{
    public static double Compute(IZeroCurve curve, double tenor, int frequency = 2)
    {
        ArgumentNullException.ThrowIfNull(curve);
        if (!(tenor > 0) || !double.IsFinite(tenor))
        {
            throw new ArgumentOutOfRangeException(nameof(tenor), tenor, "Par-yield tenor must be a positive number of years.");
        }
        if (frequency is not (1 or 2 or 4 or 12))
        {
            throw new ArgumentOutOfRangeException(nameof(frequency), frequency, "Coupon frequency must be 1, 2, 4 or 12.");
        }

        var period = 1.0 / frequency;
        var annuity = 0.0;
        var t = tenor;
        // Whole periods stepping back from the tenor; tolerance absorbs float error in T * f.
        while (t > period * (1 - 1e-9))
        {
            annuity += curve.Discount(t) * period;
            t -= period;
        }
        if (t > 1e-9)
        {
            annuity += curve.Discount(t) * t;
        }
        return (1.0 - curve.Discount(tenor)) / annuity;
    }
}
