namespace Monitor.Analytics.Curves;

/// <summary>
/// A credit curve: the base (government) zero curve plus a spread curve, z(t) = z_base(t) + s(t).
/// Factor loadings are the spread curve's: exposures of credit bonds to the base factors are
/// computed on the base curve's loadings with the discount factors of this curve.
/// </summary>
public sealed class SpreadedCurve : IZeroCurve
{
    public SpreadedCurve(IZeroCurve baseCurve, IFactorCurve spread)
    {
        BaseCurve = baseCurve ?? throw new ArgumentNullException(nameof(baseCurve));
        Spread = spread ?? throw new ArgumentNullException(nameof(spread));
    }

    public IZeroCurve BaseCurve { get; }

    public IFactorCurve Spread { get; }

    public double ZeroRate(double t) => BaseCurve.ZeroRate(t) + Spread.ZeroRate(t);

    public double Discount(double t) => Math.Exp(-ZeroRate(t) * t);

    public double InstantaneousForward(double t) => BaseCurve.InstantaneousForward(t) + Spread.InstantaneousForward(t);
}
