namespace Monitor.Analytics.Risk;

/// <summary>
/// Names the discount curve of a group of cash flows: <see cref="Government"/> (empty) for the base curve alone,
/// otherwise a spread-group name whose spread curve is added to the base curve. Keys compare ordinally.
/// </summary>
public static class CurveKey
{
    /// <summary>The key of cash flows discounted on the base (government) curve.</summary>
    public const string Government = "";

    /// <summary>Maps null to <see cref="Government"/>; other keys are kept as given.</summary>
    public static string Normalize(string? key) => key ?? Government;

    /// <summary>True for the government key (null or empty).</summary>
    public static bool IsGovernment(string? key) => string.IsNullOrEmpty(key);
}
