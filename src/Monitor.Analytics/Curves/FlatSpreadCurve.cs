namespace Monitor.Analytics.Curves;

/// <summary>
/// A spread that is the same at every maturity, s(t) = s (continuously compounded, decimal), as a one-factor curve:
/// its only factor is the level, so a bond valued on base + flat spread reports its spread risk as spread level.
/// Stands in for a spread group's curve before the group has a fitted curve (see <see cref="Pricing.FlatSpread"/>).
/// </summary>
public sealed class FlatSpreadCurve : IFactorCurve
{
    private static readonly string[] Names = ["level"];

    public FlatSpreadCurve(double spread)
    {
        CurveParameterGuard.Finite(spread, nameof(spread));
        Spread = spread;
    }

    /// <summary>The spread, decimal (0.01 = 100 bp).</summary>
    public double Spread { get; }

    public int FactorCount => 1;

    public IReadOnlyList<string> FactorNames => Names;

    public double ZeroRate(double t) => Spread;

    public double Discount(double t) => Math.Exp(-Spread * t);

    public double InstantaneousForward(double t) => Spread;

    public void Loadings(double t, Span<double> loadings) => loadings[0] = 1.0;
}
