namespace Monitor.Analytics.Tests.Oracle;

/// <summary>
/// The price formula of 31 CFR Part 356, Appendix B, section II (non-indexed securities), written literally:
/// P = [C/2 + (C/2) sum_{k=1..n} v^k + 100 v^n] / (1 + (r/s)(i/2)) - (C/2)(s - r)/s, v = 1/(1 + i/2), where
/// C = annual coupon per 100, i = yield (decimal), n = full half-years from the next coupon date to maturity,
/// r = days from settlement to the next coupon date, s = days in the current half-year. Reconstructed from the
/// appendix's definitions as summarised in /work/shared/reference-data/README.md; the sum's upper limit n was
/// fixed by reproducing the published examples A and D (n - 1 does not reproduce them).
/// </summary>
internal static class TreasuryAppendixBFormula
{
    public static double CleanPrice(double coupon, double yield, int n, int r, int s)
    {
        var v = 1.0 / (1.0 + (yield / 2));
        double annuity = 0;
        for (var k = 1; k <= n; k++)
        {
            annuity += Math.Pow(v, k);
        }

        var dirtyAtNextCoupon = (coupon / 2) + ((coupon / 2) * annuity) + (100 * Math.Pow(v, n));
        return (dirtyAtNextCoupon / (1 + ((double)r / s * (yield / 2)))) - AccruedInterest(coupon, r, s);
    }

    public static double AccruedInterest(double coupon, int r, int s) => coupon / 2 * (s - r) / s;
}
