using Monitor.Analytics.Market;
using Monitor.Files.Csv;

namespace Monitor.Files;

/// <summary>
/// Quotes file (our format, see config/examples/README.md):
/// <c>instrument_id,quote_time,bid,ask,mid,yield_pct,source</c>. Prices are clean per 100 face;
/// a row gives a mid, or a bid and an ask, or a yield in percent.
/// </summary>
public static class QuoteFile
{
    private static readonly string[] Required = ["instrument_id", "quote_time"];

    private static readonly string[] Optional = ["bid", "ask", "mid", "yield_pct", "source"];

    public static IReadOnlyList<BondQuote> Read(TextReader reader, string fileName)
    {
        var quotes = new List<BondQuote>();
        foreach (var row in CsvTable.Read(reader, fileName, Required, Optional))
        {
            var id = row.RequiredText("instrument_id");
            var time = row.RequiredTimestamp("quote_time");
            var yieldPct = row.OptionalNumber("yield_pct");
            try
            {
                quotes.Add(new BondQuote(id, time, row.OptionalNumber("bid"), row.OptionalNumber("ask"), row.OptionalNumber("mid"),
                    yieldPct / 100.0, row.OptionalText("source")));
            }
            catch (ArgumentException ex)
            {
                var column = ex.ParamName == "yield" ? "yield_pct" : ex.ParamName ?? "mid";
                throw row.Error(column, row.Raw(column), ex.Message);
            }
        }
        return quotes;
    }

    public static IReadOnlyList<BondQuote> Read(string path) => FileReading.Read(path, Read);
}
