using System.Globalization;
using Monitor.Analytics.Market;

namespace Monitor.Cli.Verbs;

/// <summary>
/// A list of tenors as a user writes it: comma-separated items, each years ("10", "0.5"), a label ("3M", "2Y") or a
/// range of whole years "a..b" (a, a+1, .., b). Returned ascending and distinct, in years.
/// </summary>
internal static class TenorList
{
    private const double MaxYears = 100;

    public static IReadOnlyList<double> Parse(string option, string text)
    {
        var years = new SortedSet<double>();
        foreach (var raw in text.Split(',', StringSplitOptions.TrimEntries))
        {
            var range = raw.Split("..", StringSplitOptions.TrimEntries);
            if (range.Length == 2 && int.TryParse(range[0], NumberStyles.None, CultureInfo.InvariantCulture, out var from)
                && int.TryParse(range[1], NumberStyles.None, CultureInfo.InvariantCulture, out var to) && from >= 1 && from <= to && to <= MaxYears)
            {
                for (var y = from; y <= to; y++)
                {
                    years.Add(y);
                }
                continue;
            }
            if (range.Length == 1 && One(raw) is { } t)
            {
                years.Add(t);
                continue;
            }
            throw CliInputException.Option(option, text,
                $"is not a list of tenors: '{raw}' is none of years (10, 0.5), a label (3M, 2Y) or a range of whole years (1..30); tenors lie in (0, {MaxYears}] years.");
        }
        return [.. years];
    }

    private static double? One(string item)
    {
        if (double.TryParse(item, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var y) || Tenor.TryParseYears(item, out y))
        {
            return y > 0 && y <= MaxYears ? y : null;
        }
        return null;
    }
}
