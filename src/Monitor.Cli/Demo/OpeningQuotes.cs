using System.Globalization;
using System.Text;

namespace Monitor.Cli.Demo;

/// <summary>
/// Writes the 08:00 burst as the service's opening quotes file (format of config/examples/README.md), so the
/// opening curves are fitted from a complete snapshot at start-up rather than from whichever quotes of the first
/// burst happen to have arrived when the refit loop first wakes.
/// </summary>
internal static class OpeningQuotes
{
    public static void Write(string path, QuoteFactory quotes)
    {
        ArgumentNullException.ThrowIfNull(quotes);
        var text = new StringBuilder();
        text.AppendLine("# Opening quotes of the invented demo day, generated from the demo's true curves (clean prices per 100 face).");
        text.AppendLine("instrument_id,quote_time,bid,ask,mid,yield_pct,source");
        foreach (var bond in quotes.Bonds)
        {
            var q = quotes.Quote(bond, DemoScenario.DayStart, step: 0);
            text.AppendLine(string.Create(CultureInfo.InvariantCulture,
                $"{q.InstrumentId},{q.QuoteTime:yyyy-MM-ddTHH:mm:ssZ},{q.BidCleanPrice:F3},{q.AskCleanPrice:F3},,,{q.Source}"));
        }
        File.WriteAllText(path, text.ToString());
    }
}
