using Monitor.Files;
using Monitor.Files.Csv;

namespace Monitor.Files.Tests;

public class InstrumentFileTests
{
    private const string Header = "id,issuer,spread_group,currency,coupon_pct,frequency,day_count,issue_date,first_coupon_date,maturity_date,face,settlement_lag\n";
    private const string InXts = "GV-2030,Republic of Examplia,,XTS,2.5,2,ACT/ACT-ICMA,2024-03-01,,2030-03-01,100,1\n";
    private const string InEur = "GV-2031,Republic of Examplia,,EUR,2.5,2,ACT/ACT-ICMA,2024-03-01,,2031-03-01,100,1\n";

    [Fact]
    public void A_bond_not_in_the_reporting_currency_is_refused_with_line_column_and_value()
    {
        var ex = Assert.Throws<CsvFileException>(() => InstrumentFile.Read(new StringReader(Header + InXts + InEur), "instruments.csv", "XTS"));

        Assert.Equal("instruments.csv", ex.File);
        Assert.Equal(3, ex.Line);
        Assert.Equal("currency", ex.Column);
        Assert.Equal("EUR", ex.Value);
        Assert.Contains("reporting currency XTS", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Bonds_in_the_reporting_currency_are_read_and_no_currency_given_means_no_check()
    {
        Assert.Single(InstrumentFile.Read(new StringReader(Header + InXts), "instruments.csv", "XTS"));
        Assert.Equal(2, InstrumentFile.Read(new StringReader(Header + InXts + InEur), "instruments.csv").Count);
    }
}
