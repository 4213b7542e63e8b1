using Monitor.Files;
using Monitor.Files.Csv;

namespace Monitor.Files.Tests;

/// <summary>A column our formats do not have is refused with the file and line, never silently ignored.</summary>
public class ExtraColumnTests
{
    private const string InstrumentHeader = "id,issuer,spread_group,currency,coupon_pct,frequency,day_count,issue_date,first_coupon_date,maturity_date,face,settlement_lag";

    [Fact]
    public void Unknown_header_column_is_refused_naming_it_and_the_header_line()
    {
        var text = "# comment\n" + InstrumentHeader + ",rating\nGV-2030,Test Treasury,,XTS,4,2,ACT/ACT-ICMA,2020-01-15,,2030-01-15,100,1,AA\n";

        var ex = Assert.Throws<CsvFileException>(() => InstrumentFile.Read(new StringReader(text), "instruments.csv"));

        Assert.Equal("instruments.csv", ex.File);
        Assert.Equal(2, ex.Line);
        Assert.Equal("rating", ex.Column);
        Assert.Contains("is not a column of this file", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Row_with_more_fields_than_the_header_is_refused_naming_its_line()
    {
        const string text = "instrument_id,quote_time,bid,ask,mid,yield_pct,source\nGV-2030,2026-03-02T14:30:00Z,,,99.5,,desk\nGV-2035,2026-03-02T14:31:00Z,,,98.5,,desk,extra\n";

        var ex = Assert.Throws<CsvFileException>(() => QuoteFile.Read(new StringReader(text), "quotes.csv"));

        Assert.Equal("quotes.csv", ex.File);
        Assert.Equal(3, ex.Line);
        Assert.Contains("8 fields but the header has 7", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("book,instrument_id,face_amount,trader")]
    [InlineData("as_of,tenor,par_yield_pct,source")]
    public void Every_format_refuses_an_extra_column(string header)
    {
        var ex = Assert.Throws<CsvFileException>(() => header.StartsWith("book", StringComparison.Ordinal)
            ? (object)PositionFile.Read(new StringReader(header + "\n"), "f.csv")
            : ParYieldFile.Read(new StringReader(header + "\n"), "f.csv"));

        Assert.Equal(1, ex.Line);
        Assert.Equal(header.Split(',')[^1], ex.Column);
    }

    [Fact]
    public void Optional_columns_may_be_left_out()
    {
        const string text = "id,issuer,spread_group,currency,coupon_pct,frequency,day_count,issue_date,maturity_date,settlement_lag\nGV-2030,Test Treasury,,XTS,4,2,ACT/ACT-ICMA,2020-01-15,2030-01-15,1\n";

        Assert.Single(InstrumentFile.Read(new StringReader(text), "instruments.csv"));
    }
}
