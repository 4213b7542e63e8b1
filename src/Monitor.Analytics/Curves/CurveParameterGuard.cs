using System.Globalization;

namespace Monitor.Analytics.Curves;

/// <summary>Validation of curve parameters with errors that name the parameter and its value.</summary>
internal static class CurveParameterGuard
{
    /// <summary>Largest decay accepted, in years; beyond it slope and level cannot be told apart.</summary>
    public const double MaxDecayYears = 100.0;

    public static void Finite(double value, string name)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(name, value, $"Curve parameter '{name}' must be a finite number, got {value.ToString(CultureInfo.InvariantCulture)}.");
        }
    }

    public static void Decay(double value, string name)
    {
        if (!double.IsFinite(value) || value <= 0 || value > MaxDecayYears)
        {
            throw new ArgumentOutOfRangeException(name, value,
                $"Curve decay '{name}' must be in (0, {MaxDecayYears}] years, got {value.ToString(CultureInfo.InvariantCulture)}.");
        }
    }
}
