namespace Monitor.Analytics.Curves;

/// <summary>
/// A zero curve moved in parallel: z(t) = z_base(t) + shift (continuously compounded, decimal: 0.0001 = 1 bp).
/// Used for effective duration and convexity.
/// </summary>
public sealed class ParallelShiftedCurve : IZeroCurve
{
    public ParallelShiftedCurve(IZeroCurve baseCurve, double shift)
    {
        BaseCurve = baseCurve ?? throw new ArgumentNullException(nameof(baseCurve));
        if (!double.IsFinite(shift))
        {
            throw new ArgumentOutOfRangeException(nameof(shift), shift, $"Curve shift must be finite; shift = {shift}.");
        }

        Shift = shift;
    }

    public IZeroCurve BaseCurve { get; }

    public double Shift { get; }

    public double ZeroRate(double t) => BaseCurve.ZeroRate(t) + Shift;

    // exp(-(z + s) t) = DF_base(t) exp(-s t): keeps the base curve's own discounting at t = 0.
    public double Discount(double t) => BaseCurve.Discount(t) * Math.Exp(-Shift * t);

    public double InstantaneousForward(double t) => BaseCurve.InstantaneousForward(t) + Shift;
}
