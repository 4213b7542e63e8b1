using Monitor.Analytics.Curves;
using QL = QLNet;

namespace Monitor.Benchmarks;

/// <summary>The QLNet (1.13.2) twins of the synthetic bonds and curves: the baselines a user would reach for.</summary>
internal static class QLNetMarket
{
    public static readonly QL.Date Today = ToQl(SyntheticMarket.ValuationDate);

    public static QL.Date ToQl(DateOnly d) => new(d.Day, d.Month, d.Year);

    public static void SetToday() => QL.Settings.setEvaluationDate(Today);

    public static QL.Schedule Schedule(SyntheticBond b)
    {
        var endOfMonth = b.Maturity.Day == DateTime.DaysInMonth(b.Maturity.Year, b.Maturity.Month);
        return new QL.Schedule(ToQl(b.Issue), ToQl(b.Maturity), new QL.Period(b.Frequency == 1 ? QL.Frequency.Annual : QL.Frequency.Semiannual),
            new QL.NullCalendar(), QL.BusinessDayConvention.Unadjusted, QL.BusinessDayConvention.Unadjusted, QL.DateGeneration.Rule.Backward, endOfMonth);
    }

    public static QL.DayCounter Icma() => new QL.ActualActual(QL.ActualActual.Convention.ISMA, null);

    /// <summary>Bond helpers quoted at our dirty prices (useCleanPrice: false), T+0 so that curve time = our ACT/365F time.</summary>
    public static (List<QL.BondHelper> Helpers, List<QL.SimpleQuote> Quotes) Helpers(IEnumerable<SyntheticBond> bonds, IReadOnlyList<double> dirtyPrices)
    {
        var helpers = new List<QL.BondHelper>();
        var quotes = new List<QL.SimpleQuote>();
        var i = 0;
        foreach (var b in bonds)
        {
            var quote = new QL.SimpleQuote(dirtyPrices[i++]);
            quotes.Add(quote);
            helpers.Add(new QL.FixedRateBondHelper(new QL.Handle<QL.Quote>(quote), 0, 100.0, Schedule(b), [b.Coupon], Icma(),
                QL.BusinessDayConvention.Unadjusted, 100.0, ToQl(b.Issue), new QL.NullCalendar(), null, null,
                QL.BusinessDayConvention.Unadjusted, false, false));
        }
        return (helpers, quotes);
    }

    /// <summary>
    /// QLNet's Nelson-Siegel fitted curve (x = b0, b1, b2, kappa = 1/tau; Simplex, accuracy 1e-10, 10,000 evaluations:
    /// the library defaults). It keeps its last solution as the guess of the next calculation: the warm start.
    /// </summary>
    public static QL.FittedBondDiscountCurve Curve(List<QL.BondHelper> helpers, double[]? guess)
    {
        var g = new QL.Vector();
        if (guess is not null)
        {
            g = new QL.Vector(4);
            for (var k = 0; k < 4; k++)
            {
                g[k] = guess[k];
            }
        }
        return new QL.FittedBondDiscountCurve(Today, helpers, new QL.Actual365Fixed(), new QL.NelsonSiegelFitting(null, null), 1e-10, 10000, g, 1.0, 100);
    }

    /// <summary>Runs the fit if quotes changed and returns the solution.</summary>
    public static double[] Solution(QL.FittedBondDiscountCurve curve)
    {
        var x = curve.fitResults().solution();
        return [x[0], x[1], x[2], x[3]];
    }

    /// <summary>QLNet NS parameters as a zero curve, QLNet's own formula (any kappa, even one our curve class refuses).</summary>
    public static IZeroCurve AsCurve(double[] x) => new QLNetNelsonSiegel(x);

    private sealed class QLNetNelsonSiegel(double[] x) : IZeroCurve
    {
        // z(t) = x0 + (x1 + x2) (1 - e^{-k t}) / (k t) - x2 e^{-k t}, k = x3 (QLNet NelsonSiegelFitting.discountFunction).
        public double ZeroRate(double t)
        {
            var k = x[3];
            var e = Math.Exp(-k * t);
            return x[0] + (x[1] + x[2]) * (1 - e) / (k * t) - x[2] * e;
        }

        public double Discount(double t) => Math.Exp(-ZeroRate(t) * t);

        public double InstantaneousForward(double t) => throw new NotSupportedException();
    }

    public static QL.FixedRateBond Bond(SyntheticBond b) =>
        new(0, 100.0, Schedule(b), [b.Coupon], Icma(), QL.BusinessDayConvention.Unadjusted, 100.0, ToQl(b.Issue),
            new QL.NullCalendar(), null, null, QL.BusinessDayConvention.Unadjusted, false);
}

/// <summary>A QLNet term structure discounting at z_base(t) + s(t) of our factor curves (t = ACT/365F years).</summary>
internal sealed class FactorCurveTermStructure : QL.YieldTermStructure
{
    private readonly IZeroCurve _curve;

    public FactorCurveTermStructure(IZeroCurve curve)
        : base(QLNetMarket.Today, new QL.NullCalendar(), new QL.Actual365Fixed())
    {
        _curve = curve;
    }

    public override QL.Date maxDate() => QL.Date.maxDate();

    protected override double discountImpl(double t) => _curve.Discount(t);
}
