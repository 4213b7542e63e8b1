namespace Monitor.Contracts.V1;

/// <summary>
/// Nelson-Siegel (1987) / Svensson (1994) parameters: zero rates continuously compounded, decimals;
/// decays in years. For a spread curve the same fields hold g0, g1, g2, tau_s of the spread.
/// <see cref="Beta3"/> and <see cref="Tau2"/> are null for Nelson-Siegel.
/// </summary>
public sealed record CurveParameters
{
    public required double Beta0 { get; init; }

    public required double Beta1 { get; init; }

    public required double Beta2 { get; init; }

    public required double Tau { get; init; }

    public double? Beta3 { get; init; }

    public double? Tau2 { get; init; }
}
