using Monitor.Files;
using Monitor.Files.Csv;

namespace Monitor.Files.Tests;

public class ParYieldFileTests
{
    [Fact]
    public void Groups_by_date_keeps_blank_tenors_without_a_yield_and_converts_units()
    {
        const string text = """
            as_of,tenor,par_yield_pct
            2026-03-02,1M,3.10
            2026-03-02,2M,
            2026-03-02,10Y,4.25
            2026-03-03,6M,3.20
            """;
        var sets = ParYieldFile.Read(new StringReader(text), "par.csv");
        Assert.Equal(2, sets.Count);
        Assert.Equal(3, sets[0].Points.Count);
        Assert.Equal(1.0 / 12.0, sets[0].Points[0].TenorYears, 12);
        Assert.Null(sets[0].Points[1].ParYield); // 2M: not published, kept so a fit can show it left out
        Assert.Equal(0.0425, sets[0].Points[2].ParYield!.Value, 12);
        Assert.Equal(0.5, sets[1].Points[0].TenorYears, 12);
    }

    [Fact]
    public void Bad_tenor_is_named()
    {
        var ex = Assert.Throws<CsvFileException>(() => ParYieldFile.Read(new StringReader("as_of,tenor,par_yield_pct\n2026-03-02,10W,4\n"), "par.csv"));
        Assert.Equal("tenor", ex.Column);
        Assert.Equal("10W", ex.Value);
    }
}
