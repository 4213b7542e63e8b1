using Monitor.Files;
using Monitor.Files.Csv;

namespace Monitor.Files.Tests;

public class QuoteFileTests
{
    [Fact]
    public void Reads_mid_bid_ask_and_yield_quotes()
    {
        const string text = """
            # a comment before the header is allowed
            instrument_id,quote_time,bid,ask,mid,yield_pct,source
            # comment lines are skipped
            GV-2030,2026-03-02T14:30:00Z,,,99.5,,desk
            GV-2035,2026-03-02T14:31:00Z,98.25,98.75,,,desk

            GV-2040,2026-03-02T14:32:00Z,,,,4.125,feed
            """;
        var quotes = QuoteFile.Read(new StringReader(text), "quotes.csv");

        Assert.Equal(3, quotes.Count);
        Assert.Equal(99.5, quotes[0].CleanMid);
        Assert.Equal(98.5, quotes[1].CleanMid);
        Assert.Null(quotes[2].CleanMid);
        Assert.Equal(0.04125, quotes[2].Yield!.Value, 12);
        Assert.Equal(new DateTimeOffset(2026, 3, 2, 14, 31, 0, TimeSpan.Zero), quotes[1].QuoteTime);
    }

    [Theory]
    [InlineData("2026-06-01T16:30:00Z", "2026-06-01T16:30:00+00:00")]
    [InlineData("2026-06-01T16:30Z", "2026-06-01T16:30:00+00:00")]
    [InlineData("2026-06-01T16:30:00.125+01:00", "2026-06-01T15:30:00.125+00:00")]
    [InlineData("2026-06-01T16:30:00", "2026-06-01T16:30:00+00:00")] // no offset: UTC (config/examples/README.md)
    public void Iso_8601_times_are_read_with_their_offset(string written, string expected)
    {
        var text = "instrument_id,quote_time,bid,ask,mid,yield_pct,source\nGV-2030," + written + ",,,99,,x\n";
        Assert.Equal(DateTimeOffset.Parse(expected, System.Globalization.CultureInfo.InvariantCulture), QuoteFile.Read(new StringReader(text), "quotes.csv")[0].QuoteTime);
    }

    [Theory]
    [InlineData("GV-2030,2026-03-02T14:30:00Z,,,abc,,x", 2, "mid", "abc")]
    [InlineData("GV-2030,yesterday,,,99,,x", 2, "quote_time", "yesterday")]
    [InlineData("GV-2030,01/06/2026 16:30,,,99,,x", 2, "quote_time", "01/06/2026 16:30")] // day-first: once read as 6 January
    [InlineData("GV-2030,06/01/2026 16:30,,,99,,x", 2, "quote_time", "06/01/2026 16:30")]
    [InlineData("GV-2030,2026-06-01 16:30,,,99,,x", 2, "quote_time", "2026-06-01 16:30")]
    [InlineData("GV-2030,1 June 2026 16:30,,,99,,x", 2, "quote_time", "1 June 2026 16:30")]
    [InlineData("GV-2030,2026-06-01,,,99,,x", 2, "quote_time", "2026-06-01")]
    [InlineData("GV-2030,2026-03-02T14:30:00Z,,,-5,,x", 2, "mid", "-5")]
    [InlineData("GV-2030,2026-03-02T14:30:00Z,,,NaN,,x", 2, "mid", "NaN")]
    [InlineData("GV-2030,2026-03-02T14:30:00Z,,,,250,x", 2, "yield_pct", "250")]
    [InlineData("GV-2030,2026-03-02T14:30:00Z,99,,,,x", 2, "mid", "")]
    public void Bad_rows_name_file_line_column_and_value(string row, int line, string column, string value)
    {
        var text = "instrument_id,quote_time,bid,ask,mid,yield_pct,source\n" + row + "\n";
        var ex = Assert.Throws<CsvFileException>(() => QuoteFile.Read(new StringReader(text), "quotes.csv"));
        Assert.Equal("quotes.csv", ex.File);
        Assert.Equal(line, ex.Line);
        Assert.Equal(column, ex.Column);
        Assert.Equal(value, ex.Value);
        Assert.Contains("quotes.csv, line 2", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_columns_are_named()
    {
        var ex = Assert.Throws<CsvFileException>(() => QuoteFile.Read(new StringReader("instrument_id,mid\nA,100\n"), "q.csv"));
        Assert.Contains("quote_time", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_file_is_a_clear_error()
    {
        var ex = Assert.Throws<CsvFileException>(() => QuoteFile.Read("/nonexistent/quotes.csv"));
        Assert.Contains("/nonexistent/quotes.csv", ex.Message, StringComparison.Ordinal);
    }
}
