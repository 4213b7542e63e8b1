using System.Globalization;
using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Pricing;

/// <summary>
/// The flat (zero-volatility) spread s over a base zero curve that reprices a bond:
/// sum_i A_i exp(-(z(t_i) + s) t_i) = P (Fabozzi, Fixed Income Analysis, 2nd ed., ch. 6, "zero-volatility spread").
/// Solved by Newton's method; the price is strictly decreasing in s for positive flows, so the root is unique.
/// </summary>
public static class FlatSpread
{
    /// <summary>Spreads beyond +-100% (decimal 1.0) are a wrong price, not a credit spread.</summary>
    public const double MaxAbsSpread = 1.0;

    private const int MaxIterations = 100;

    /// <param name="baseCurve">The base (government) zero curve.</param>
    /// <param name="times">Flow times in years on the curve's clock (ACT/365F).</param>
    /// <param name="amounts">Flow amounts, per 100 face.</param>
    /// <param name="dirtyPrice">The price to match, per 100 face (clean price plus accrued interest).</param>
    /// <returns>The spread, decimal (0.01 = 100 bp).</returns>
    /// <exception cref="ArgumentException">No spread within +-<see cref="MaxAbsSpread"/> reprices the bond.</exception>
    public static double Solve(IZeroCurve baseCurve, ReadOnlySpan<double> times, ReadOnlySpan<double> amounts, double dirtyPrice)
    {
        ArgumentNullException.ThrowIfNull(baseCurve);
        if (times.Length != amounts.Length || times.Length == 0)
        {
            throw new ArgumentException("A flat spread needs at least one cash flow and one time per flow.", nameof(times));
        }
        if (!double.IsFinite(dirtyPrice) || dirtyPrice <= 0)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"Dirty price {dirtyPrice} is not a positive number."), nameof(dirtyPrice));
        }
        Span<double> discounted = times.Length <= 256 ? stackalloc double[times.Length] : new double[times.Length];
        for (var i = 0; i < times.Length; i++)
        {
            discounted[i] = times[i] > 0 ? amounts[i] * baseCurve.Discount(times[i]) : 0.0;
        }
        var s = 0.0;
        for (var iteration = 0; iteration < MaxIterations; iteration++)
        {
            double price = 0, slope = 0;
            for (var i = 0; i < times.Length; i++)
            {
                var pv = discounted[i] * Math.Exp(-s * times[i]);
                price += pv;
                slope -= pv * times[i];
            }
            var error = price - dirtyPrice;
            if (Math.Abs(error) <= 1e-12 * dirtyPrice)
            {
                return s;
            }
            if (slope >= 0)
            {
                break;
            }
            s = Math.Clamp(s - error / slope, -MaxAbsSpread, MaxAbsSpread);
        }
        throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
            $"No flat spread within +-{MaxAbsSpread * 1e4:F0} bp reprices the bond at {dirtyPrice:G6}."), nameof(dirtyPrice));
    }
}
