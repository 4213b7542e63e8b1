using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Pricing;

/// <summary>
/// A bond's remaining cash flows placed on the yield's time grid: amounts and exponents e_j (in coupon periods from
/// settlement), with the discounting rule of a <see cref="YieldConvention"/>. Gives P(y), dP/dy and d2P/dy2.
/// </summary>
internal sealed class YieldCashFlowModel
{
    private readonly double[] _amounts;
    private readonly double[] _exponents;

    private YieldCashFlowModel(double[] amounts, double[] exponents, int frequency, double stub, bool simpleStub, double accrued)
    {
        _amounts = amounts;
        _exponents = exponents;
        Frequency = frequency;
        Stub = stub;
        SimpleStub = simpleStub;
        Accrued = accrued;
    }

    /// <summary>Compounding frequency of the yield (2 for a zero-coupon bond).</summary>
    public int Frequency { get; }

    /// <summary>w: periods from settlement to the first flow.</summary>
    public double Stub { get; }

    /// <summary>True when the first (fractional) period is discounted with simple interest.</summary>
    public bool SimpleStub { get; }

    public double Accrued { get; }

    public int Count => _amounts.Length;

    public static YieldCashFlowModel Build(Bond bond, DateOnly settlement, YieldConvention convention)
    {
        ArgumentNullException.ThrowIfNull(bond);
        bond.RequireSettlement(settlement);
        var accrued = bond.AccruedInterest(settlement);

        if (bond.Schedule is null)
        {
            // Zero coupon: semiannual (bond-equivalent) compounding over quasi-coupon periods counted back from
            // maturity; e = 2 x year fraction. Simple interest within half a year (street, Treasury bill
            // coupon-equivalent practice; see YieldConvention.Street).
            const int f = 2;
            var referenceStart = bond.MaturityDate.AddMonths(-6);
            var e = f * bond.DayCounter.YearFraction(settlement, bond.MaturityDate, referenceStart, bond.MaturityDate, f);
            var simple = convention != YieldConvention.Compounded && e <= 1.0;
            return new YieldCashFlowModel([100.0], [e], f, e, simple, accrued);
        }

        var periods = bond.Schedule.Periods;
        var first = bond.Schedule.PeriodIndexContaining(settlement);
        var amounts = new double[periods.Count - first];
        var exponents = new double[periods.Count - first];
        var freq = bond.Frequency;
        var p0 = periods[first];
        var w = PeriodsBetween(bond, settlement, p0);
        var exponent = w;
        for (var i = first; i < periods.Count; i++)
        {
            var period = periods[i];
            if (i > first)
            {
                // Whole periods count 1; an odd (short last) period counts its day-count fraction of a period.
                exponent += period.IsRegular ? 1.0 : PeriodsBetween(bond, period.Start, period);
            }

            amounts[i - first] = bond.CouponAmount(period) + (i == periods.Count - 1 ? 100.0 : 0.0);
            exponents[i - first] = exponent;
        }

        var simpleStub = convention switch
        {
            YieldConvention.Street => amounts.Length == 1,
            YieldConvention.TreasuryAuction => true,
            _ => false,
        };
        return new YieldCashFlowModel(amounts, exponents, freq, w, simpleStub, accrued);
    }

    /// <summary>
    /// Coupon periods from <paramref name="from"/> to the end of <paramref name="period"/> (SIA's DSC/E). 30/360
    /// bonds count 30/360 days over 360/f; every actual-day convention counts actual days over the actual days of
    /// the (quasi-)coupon period, i.e. the ICMA fraction, so that a whole period is exactly 1 and a par bond prices
    /// at 100 on a coupon date. Trap: f x ACT/360 year fraction would make a 92-day quarter 1.022 periods.
    /// </summary>
    private static double PeriodsBetween(Bond bond, DateOnly from, CouponPeriod period)
    {
        var f = bond.Frequency;
        var counter = bond.DayCount is DayCountConvention.Thirty360BondBasis or DayCountConvention.Thirty360European
            ? bond.DayCounter
            : DayCounters.For(DayCountConvention.ActActIcma);
        return f * counter.YearFraction(from, period.End, period.ReferenceStart, period.ReferenceEnd, f);
    }

    /// <summary>Time of flow <paramref name="j"/> in years, e_j / f.</summary>
    public double Time(int j) => _exponents[j] / Frequency;

    /// <summary>
    /// The part of the stub discounted with simple interest: the fraction of a period up to the next (quasi-)coupon
    /// date, w - (ceil(w) - 1). For a long first period (w &gt; 1) the whole periods beyond it compound
    /// (31 CFR 356 App. B, II.C: [1 + (r/s)(i/2)] with r, s of the initial short portion, then v for the rest).
    /// </summary>
    public double SimpleFraction => Stub - (Math.Ceiling(Stub) - 1.0);

    /// <summary>Dirty price at yield <paramref name="y"/> with first and second derivatives in y.</summary>
    public (double Price, double First, double Second) Evaluate(double y)
    {
        double f = Frequency;
        var a = SimpleFraction;
        var baseFactor = 1.0 + (y / f);
        var stubFactor = 1.0 + (a * y / f);
        double p = 0, d1 = 0, d2 = 0;
        for (var j = 0; j < _amounts.Length; j++)
        {
            // ln d = -ln(1 + a y/f) - k ln(1 + y/f) with k = e_j - a (simple stub), or -e_j ln(1 + y/f) (compounded).
            double g1, g2, d;
            if (SimpleStub)
            {
                var k = _exponents[j] - a;
                d = Math.Pow(baseFactor, -k) / stubFactor;
                g1 = (-(a / f) / stubFactor) - (k / f / baseFactor);
                g2 = (a / f * (a / f) / (stubFactor * stubFactor)) + (k / (f * f) / (baseFactor * baseFactor));
            }
            else
            {
                var e = _exponents[j];
                d = Math.Pow(baseFactor, -e);
                g1 = -e / f / baseFactor;
                g2 = e / (f * f) / (baseFactor * baseFactor);
            }

            var pv = _amounts[j] * d;
            p += pv;
            d1 += pv * g1;
            d2 += pv * (g2 + (g1 * g1));
        }

        return (p, d1, d2);
    }

    /// <summary>sum(t_j PV_j) at yield <paramref name="y"/>, for Macaulay duration.</summary>
    public double TimeWeightedValue(double y)
    {
        double sum = 0;
        double f = Frequency;
        var a = SimpleFraction;
        for (var j = 0; j < _amounts.Length; j++)
        {
            var d = SimpleStub
                ? Math.Pow(1.0 + (y / f), -(_exponents[j] - a)) / (1.0 + (a * y / f))
                : Math.Pow(1.0 + (y / f), -_exponents[j]);
            sum += Time(j) * _amounts[j] * d;
        }

        return sum;
    }
}
