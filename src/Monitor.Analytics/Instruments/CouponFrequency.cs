namespace Monitor.Analytics.Instruments;

/// <summary>
/// Coupon payments per year: 0 (zero-coupon bill or bond), 1, 2, 4 or 12. Anything else is rejected.
/// </summary>
public static class CouponFrequency
{
    public const int ZeroCoupon = 0;
    public const int Annual = 1;
    public const int Semiannual = 2;
    public const int Quarterly = 4;
    public const int Monthly = 12;

    public static bool IsValid(int frequency) => frequency is ZeroCoupon or Annual or Semiannual or Quarterly or Monthly;

    /// <summary>Throws, naming the value, unless <paramref name="frequency"/> is 0, 1, 2, 4 or 12.</summary>
    public static int Validate(int frequency, string field = "Frequency")
    {
        if (!IsValid(frequency))
        {
            throw new ArgumentOutOfRangeException(field, frequency, $"{field} must be 0 (zero coupon), 1, 2, 4 or 12 payments a year; {field} = {frequency}.");
        }

        return frequency;
    }

    /// <summary>Months in one regular coupon period (12 / frequency); not defined for zero-coupon.</summary>
    public static int MonthsPerPeriod(int frequency)
    {
        Validate(frequency);
        if (frequency == ZeroCoupon)
        {
            throw new ArgumentOutOfRangeException(nameof(frequency), frequency, "A zero-coupon bond has no coupon period; frequency = 0.");
        }

        return 12 / frequency;
    }
}
