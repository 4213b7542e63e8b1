using Monitor.Analytics.Risk;

namespace Monitor.Service.Engine;

/// <summary>Names curves for people and messages: "government" for the base curve, else the spread group.</summary>
public static class CurveKeyLabel
{
    public const string Government = "government";

    public static string Of(string key) => CurveKey.IsGovernment(key) ? Government : key;

    public static string KeyOf(string label) => label == Government ? CurveKey.Government : label;
}
