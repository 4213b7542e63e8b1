using System.Globalization;
using System.Text;

namespace Monitor.Cli.Load;

/// <summary>
/// Writes the opening quotes file of <c>monitor load</c> (format of config/examples/README.md): one quote per bond from
/// the start of the tape, stamped with the real time given so the service's stale-quote rule keeps them.
/// </summary>
internal static class OpeningTape
{
    public static void Write(string path, QuoteStream stream, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(stream);
        var text = new StringBuilder("# Opening quotes of monitor load (generated from the demo's moving market).\ninstrument_id,quote_time,bid,ask,mid,yield_pct,source\n");
        foreach (var bond in stream.Factory.Bonds)
        {
            var q = stream.Factory.Quote(bond, stream.SimulatedTime(0), step: 0);
            text.Append(CultureInfo.InvariantCulture, $"{q.InstrumentId},{now:yyyy-MM-ddTHH:mm:ssZ},{q.BidCleanPrice:F3},{q.AskCleanPrice:F3},,,load-feed\n");
        }
        File.WriteAllText(path, text.ToString());
    }
}
