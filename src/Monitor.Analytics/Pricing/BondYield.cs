using System.Globalization;
using MathNet.Numerics.RootFinding;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Pricing;

/// <summary>
/// Price &lt;-&gt; yield for fixed-coupon and zero-coupon bonds, per 100 face. Yields are decimals compounded at the
/// coupon frequency (see <see cref="YieldConvention"/>); prices per 100 face; dirty = clean + accrued.
/// </summary>
public static class BondYield
{
    /// <summary>Lowest yield accepted or searched (-25%).</summary>
    public const double MinYield = -0.25;

    /// <summary>Highest yield accepted or searched (500%).</summary>
    public const double MaxYield = 5.0;

    private const double YieldTolerance = 1e-12;

    public static double DirtyPrice(Bond bond, DateOnly settlement, double yield, YieldConvention convention = YieldConvention.Street)
    {
        RequireYield(yield);
        return YieldCashFlowModel.Build(bond, settlement, convention).Evaluate(yield).Price;
    }

    public static double CleanPrice(Bond bond, DateOnly settlement, double yield, YieldConvention convention = YieldConvention.Street)
    {
        RequireYield(yield);
        var model = YieldCashFlowModel.Build(bond, settlement, convention);
        return model.Evaluate(yield).Price - model.Accrued;
    }

    /// <summary>Yield from a clean price per 100 face: Newton from the current yield, Brent on [MinYield, MaxYield] as fallback.</summary>
    public static double FromCleanPrice(Bond bond, DateOnly settlement, double cleanPrice, YieldConvention convention = YieldConvention.Street)
    {
        RequirePrice(cleanPrice, "cleanPrice");
        var model = YieldCashFlowModel.Build(bond, settlement, convention);
        return Solve(bond, model, cleanPrice + model.Accrued, cleanPrice, "cleanPrice");
    }

    /// <summary>Yield from a dirty price per 100 face.</summary>
    public static double FromDirtyPrice(Bond bond, DateOnly settlement, double dirtyPrice, YieldConvention convention = YieldConvention.Street)
    {
        RequirePrice(dirtyPrice, "dirtyPrice");
        var model = YieldCashFlowModel.Build(bond, settlement, convention);
        return Solve(bond, model, dirtyPrice, dirtyPrice, "dirtyPrice");
    }

    /// <summary>Price, durations, convexity and DV01 at <paramref name="yield"/>.</summary>
    public static YieldMeasures Measures(Bond bond, DateOnly settlement, double yield, YieldConvention convention = YieldConvention.Street)
    {
        RequireYield(yield);
        var model = YieldCashFlowModel.Build(bond, settlement, convention);
        var (p, d1, d2) = model.Evaluate(yield);
        var down = model.Evaluate(yield - 1e-4).Price;
        return new YieldMeasures(
            Yield: yield,
            CleanPrice: p - model.Accrued,
            AccruedInterest: model.Accrued,
            DirtyPrice: p,
            MacaulayDuration: model.TimeWeightedValue(yield) / p,
            ModifiedDuration: -d1 / p,
            Convexity: d2 / p,
            Dv01: down - p);
    }

    private static double Solve(Bond bond, YieldCashFlowModel model, double dirtyTarget, double quoted, string field)
    {
        // Newton: the price is smooth, decreasing and convex in y, so it converges from a sensible start.
        var y = bond.CouponRate > 0m ? (double)bond.CouponRate : 0.05;
        for (var i = 0; i < 50; i++)
        {
            var (p, d1, _) = model.Evaluate(y);
            if (!double.IsFinite(p) || d1 >= 0)
            {
                break;
            }

            var step = (p - dirtyTarget) / d1;
            y -= step;
            if (!double.IsFinite(y) || y < MinYield || y > MaxYield)
            {
                break;
            }

            if (Math.Abs(step) < YieldTolerance)
            {
                return y;
            }
        }

        // Fallback: bracket the whole accepted range (price is monotone in y).
        var atMin = model.Evaluate(MinYield).Price;
        var atMax = model.Evaluate(MaxYield).Price;
        if (dirtyTarget > atMin || dirtyTarget < atMax)
        {
            throw new ArgumentOutOfRangeException(
                field,
                quoted,
                string.Create(CultureInfo.InvariantCulture, $"Bond {bond.Id}: {field} = {quoted} implies a yield outside [{MinYield}, {MaxYield}] (dirty price range {atMax:F6} .. {atMin:F6})."));
        }

        if (Brent.TryFindRoot(yy => model.Evaluate(yy).Price - dirtyTarget, MinYield, MaxYield, YieldTolerance, 200, out var root))
        {
            return root;
        }

        throw new ArithmeticException(string.Create(CultureInfo.InvariantCulture, $"Bond {bond.Id}: no yield found for {field} = {quoted}."));
    }

    private static void RequireYield(double yield)
    {
        if (!double.IsFinite(yield) || yield < MinYield || yield > MaxYield)
        {
            throw new ArgumentOutOfRangeException(
                nameof(yield),
                yield,
                string.Create(CultureInfo.InvariantCulture, $"yield = {yield} must be a finite decimal rate in [{MinYield}, {MaxYield}] (0.05 = 5%)."));
        }
    }

    private static void RequirePrice(double price, string field)
    {
        if (!double.IsFinite(price) || price <= 0 || price > 10_000)
        {
            throw new ArgumentOutOfRangeException(
                field,
                price,
                string.Create(CultureInfo.InvariantCulture, $"{field} = {price} must be a finite price per 100 face in (0, 10000]."));
        }
    }
}
