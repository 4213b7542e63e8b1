using Monitor.Analytics.Risk;

namespace Monitor.Service.Engine;

/// <summary>Names curves for people and messages: "government" for the base curve, else the spread group.</summary>
public static class CurveKeyLabel
{
    public const string Government = "government";

    /// <summary>The reference curve fitted from par yields while bond quotes fit the valuation curve.</summary>
    public const string GovernmentPar = "government-par";

    /// <summary>The reference curve fitted from government bond quotes while par yields fit the valuation curve.</summary>
    public const string GovernmentBonds = "government-bonds";

    /// <summary>Whether the key is a reference curve's (fitted and published, never used for figures).</summary>
    public static bool IsReference(string key) => key is GovernmentPar or GovernmentBonds;

    public static string Of(string key) => CurveKey.IsGovernment(key) ? Government : key;

    public static string KeyOf(string label) => label == Government ? CurveKey.Government : label;
}
