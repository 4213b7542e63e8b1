using System.Globalization;

namespace Monitor.Analytics.Market;

/// <summary>Tenor labels such as "1M", "6M", "2Y", "30Y" converted to years (months / 12).</summary>
public static class Tenor
{
    public static bool TryParseYears(string text, out double years)
    {
        years = 0;
        if (string.IsNullOrWhiteSpace(text) || text.Length < 2)
        {
            return false;
        }
        var unit = char.ToUpperInvariant(text[^1]);
        if (!int.TryParse(text.AsSpan(0, text.Length - 1), NumberStyles.None, CultureInfo.InvariantCulture, out var count) || count <= 0)
        {
            return false;
        }
        years = unit switch
        {
            'M' => count / 12.0,
            'Y' => count,
            _ => 0,
        };
        return years > 0;
    }
}
