using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// Seeded bond-like instruments priced exactly on a known curve: semiannual coupons 0..8%, maturities
/// 0.5..30 years, coupon times stepping back from maturity by 0.5 (a short first period when the maturity
/// is not a whole number of half-years). Duration = Fisher-Weil duration on the pricing curve.
/// </summary>
internal static class SyntheticBonds
{
    public static List<FitInstrument> Generate(int count, int seed, IZeroCurve curve)
    {
        var rng = new Random(seed);
        var list = new List<FitInstrument>(count);
        for (var i = 0; i < count; i++)
        {
            var maturity = 0.5 + rng.NextDouble() * 29.5;
            var coupon = Math.Round(rng.NextDouble() * 8.0 * 8) / 8; // percent, eighths
            list.Add(Price($"B{i:D3}", maturity, coupon, curve));
        }
        return list;
    }

    public static FitInstrument Price(string id, double maturity, double couponPercent, IZeroCurve curve)
    {
        var times = new List<double>();
        for (var t = maturity; t > 1e-9; t -= 0.5)
        {
            times.Insert(0, t);
        }
        var amounts = times.Select(_ => couponPercent / 2).ToArray();
        amounts[^1] += 100;
        var tArr = times.ToArray();
        double pv = 0, tpv = 0;
        for (var j = 0; j < tArr.Length; j++)
        {
            var v = amounts[j] * curve.Discount(tArr[j]);
            pv += v;
            tpv += tArr[j] * v;
        }
        return new FitInstrument(id, tArr, amounts, pv, tpv / pv);
    }

    /// <summary>Same instrument with its price moved by a yield shift of <paramref name="bp"/> (approximately: dP = -P D dy).</summary>
    public static FitInstrument ShiftYield(FitInstrument ins, double bp) =>
        ins with { DirtyPrice = ins.DirtyPrice * (1 - ins.Duration * bp * 1e-4) };
}
