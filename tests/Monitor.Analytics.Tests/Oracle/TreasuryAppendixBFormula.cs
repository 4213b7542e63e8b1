namespace Monitor.Analytics.Tests.Oracle;

/// <summary>
/// The price formulas of 31 CFR Part 356, Appendix B, section II (non-indexed securities), written literally.
/// v = 1/(1 + i/2), a_n = sum_{k=1..n} v^k, C = annual coupon per 100, i = yield (decimal), n = full half-years from
/// the next (quasi-)coupon date to maturity, r = days from settlement (or issue) to the next coupon date (for a long
/// first period: to the end of the initial short portion), s = days in the half-year holding r.
/// The formulas and published results were taken from secondary quotations of the appendix (see each method and
/// Data/README.md); the regulation text itself could not be opened with the tools available.
/// </summary>
internal static class TreasuryAppendixBFormula
{
    /// <summary>
    /// II.A (regular first period, r = s) and II.B (short first period, issue date = settlement):
    /// P [1 + (r/s)(i/2)] = (r/s)(C/2) + (C/2) a_n + 100 v^n.
    /// </summary>
    public static double PriceAtIssueShortOrRegularFirst(double coupon, double yield, int n, int r, int s)
    {
        var v = V(yield);
        return (((double)r / s * coupon / 2) + (coupon / 2 * Annuity(v, n)) + (100 * Math.Pow(v, n))) / (1 + ((double)r / s * (yield / 2)));
    }

    /// <summary>
    /// II.C (long first period, issue date = settlement, r and s of the initial short portion): the first coupon
    /// (C/2)(1 + r/s) is paid one half-year after the quasi-coupon date:
    /// P [1 + (r/s)(i/2)] = (r/s)(C/2) v + (C/2) a_n + 100 v^n. (This arrangement of the terms is ours; it
    /// reproduces the published 99.805118.)
    /// </summary>
    public static double PriceAtIssueLongFirst(double coupon, double yield, int n, int r, int s)
    {
        var v = V(yield);
        return (((double)r / s * coupon / 2 * v) + (coupon / 2 * Annuity(v, n)) + (100 * Math.Pow(v, n))) / (1 + ((double)r / s * (yield / 2)));
    }

    /// <summary>
    /// II.D (settlement inside a regular period): (P + A)[1 + (r/s)(i/2)] = C/2 + (C/2) a_n + 100 v^n, A = [(s - r)/s](C/2).
    /// Returns the clean price P. With n = 0 this is the final-period (simple interest) price.
    /// </summary>
    public static double CleanPriceInRegularPeriod(double coupon, double yield, int n, int r, int s)
    {
        var v = V(yield);
        var dirty = ((coupon / 2) + (coupon / 2 * Annuity(v, n)) + (100 * Math.Pow(v, n))) / (1 + ((double)r / s * (yield / 2)));
        return dirty - AccruedInRegularPeriod(coupon, r, s);
    }

    public static double AccruedInRegularPeriod(double coupon, int r, int s) => coupon / 2 * (s - r) / s;

    /// <summary>
    /// II.E (settlement in the regular portion of a long first period): (P + A)[1 + (r/s)(i/2)] =
    /// (r'/s')(C/2) + C/2 + (C/2) a_n + 100 v^n, A = (r'/s')(C/2) + [(s - r)/s](C/2); r', s' = days of the initial
    /// short portion and of the half-year that holds it. Returns (clean price, accrued).
    /// </summary>
    public static (double Clean, double Accrued) ReopeningInLongFirstPeriod(double coupon, double yield, int n, int r, int s, int rShort, int sShort)
    {
        var v = V(yield);
        var accrued = ((double)rShort / sShort * coupon / 2) + AccruedInRegularPeriod(coupon, r, s);
        var dirty = (((double)rShort / sShort * coupon / 2) + (coupon / 2) + (coupon / 2 * Annuity(v, n)) + (100 * Math.Pow(v, n)))
                    / (1 + ((double)r / s * (yield / 2)));
        return (dirty - accrued, accrued);
    }

    private static double V(double yield) => 1.0 / (1.0 + (yield / 2));

    private static double Annuity(double v, int n)
    {
        double sum = 0;
        for (var k = 1; k <= n; k++)
        {
            sum += Math.Pow(v, k);
        }

        return sum;
    }
}
