using System.Globalization;
using Monitor.Analytics.Curves;

namespace Monitor.Analytics.Attribution;

/// <summary>
/// Reads the betas of a factor curve and builds the same model with other betas but the original decays,
/// so a curve change splits into a beta move (explained by factor durations) and a decay (tau) change.
/// Knows <see cref="NelsonSiegelCurve"/> and <see cref="SvenssonCurve"/>; other models are refused by name.
/// </summary>
internal static class FactorCurveParameters
{
    public static double[] Betas(IFactorCurve curve, string name) => curve switch
    {
        NelsonSiegelCurve ns => [ns.Beta0, ns.Beta1, ns.Beta2],
        SvenssonCurve sv => [sv.Beta0, sv.Beta1, sv.Beta2, sv.Beta3],
        _ => throw Unsupported(curve, name),
    };

    /// <summary>The model of <paramref name="shape"/> (its decays) with the given betas.</summary>
    public static IFactorCurve WithBetas(IFactorCurve shape, ReadOnlySpan<double> betas, string name) => shape switch
    {
        NelsonSiegelCurve ns => new NelsonSiegelCurve(betas[0], betas[1], betas[2], ns.Tau),
        SvenssonCurve sv => new SvenssonCurve(betas[0], betas[1], betas[2], betas[3], sv.Tau1, sv.Tau2),
        _ => throw Unsupported(shape, name),
    };

    /// <summary>Checks that a curve and its successor are the same model, so their betas compare one to one.</summary>
    public static void SameModel(IFactorCurve before, IFactorCurve after, string name)
    {
        if (before.GetType() != after.GetType())
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Curve '{name}' changed model between the two states ({before.GetType().Name} -> {after.GetType().Name}); factor moves need the same model."),
                name);
        }
    }

    private static ArgumentException Unsupported(IFactorCurve curve, string name) =>
        new(string.Create(CultureInfo.InvariantCulture,
            $"Curve '{name}' is a {curve.GetType().Name}; return attribution knows NelsonSiegelCurve and SvenssonCurve."), name);
}
