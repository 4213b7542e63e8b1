using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Tests.Support;

/// <summary>A flat continuously compounded zero curve for tests.</summary>
internal sealed class FlatCurve(double rate) : IZeroCurve
{
    public double ZeroRate(double t) => rate;

    public double Discount(double t) => Math.Exp(-rate * t);

    public double InstantaneousForward(double t) => rate;
}
