namespace Monitor.Analytics.Curves;

/// <summary>
/// A zero-coupon curve. Time <c>t</c> is in years from the curve's valuation date
/// (ACT/365F, see <see cref="CurveTime"/>); rates are decimals (0.05 = 5%), continuously compounded.
/// </summary>
public interface IZeroCurve
{
    /// <summary>Zero rate to time <paramref name="t"/>, continuously compounded.</summary>
    double ZeroRate(double t);

    /// <summary>Discount factor exp(-z(t) t).</summary>
    double Discount(double t);

    /// <summary>Instantaneous forward rate f(t) = d/dt [z(t) t].</summary>
    double InstantaneousForward(double t);
}
