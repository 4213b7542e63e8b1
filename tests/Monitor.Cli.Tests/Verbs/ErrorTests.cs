using Monitor.Cli.Tests.Support;

namespace Monitor.Cli.Tests.Verbs;

/// <summary>Bad files exit 2 naming file, line, column and value; bad options exit 1 naming option and value.</summary>
public class ErrorTests
{
    [Fact]
    public void Corrupted_quotes_file_exits_2_naming_line_column_and_value()
    {
        using var temp = new TempFolder();
        // Line 5 of the file (comment line 1, header line 2) is VGB-2029-02.
        var quotes = temp.Edited("quotes-close.csv", line => line.StartsWith("VGB-2029-02,", StringComparison.Ordinal) ? line.Replace("98.275", "98.2x5", StringComparison.Ordinal) : line);

        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"), "--quotes", quotes);

        Assert.Equal(2, exit);
        Assert.Contains("quotes-close.csv, line 5, column 'bid'", error, StringComparison.Ordinal);
        Assert.Contains("'98.2x5'", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Corrupted_instruments_file_exits_2_naming_line_column_and_value()
    {
        using var temp = new TempFolder();
        var instruments = temp.Edited("instruments.csv", line => line.StartsWith("VGB-2030-08,", StringComparison.Ordinal) ? line.Replace("2030-08-15,100", "2030-02-30,100", StringComparison.Ordinal) : line);

        var (exit, _, error) = CliRun.Invoke("risk", "--instruments", instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--positions", CliRun.Data("positions.csv"));

        Assert.Equal(2, exit);
        Assert.Contains("instruments.csv, line 6, column 'maturity_date'", error, StringComparison.Ordinal);
        Assert.Contains("'2030-02-30'", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Position_in_an_unknown_instrument_exits_2_naming_its_line()
    {
        using var temp = new TempFolder();
        var positions = temp.Write("positions.csv", File.ReadAllLines(CliRun.Data("positions.csv")).Append("RATES-CORE,VGB-2099-01,1000000"));

        var (exit, _, error) = CliRun.Invoke("risk", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv"), "--positions", positions);

        Assert.Equal(2, exit);
        Assert.Contains("positions.csv, line 16, column 'instrument_id': 'VGB-2099-01' is not in the instruments file", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_file_exits_2_naming_the_file()
    {
        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"), "--quotes", "no-such-quotes.csv");

        Assert.Equal(2, exit);
        Assert.Contains("no-such-quotes.csv", error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--valuation-date", "2026-13-01")]
    [InlineData("--model", "cubic-spline")]
    [InlineData("--base-max-rmse-bp", "-1")]
    [InlineData("--stale-after-hours", "0")]
    public void Bad_option_value_exits_1_naming_option_and_value(string option, string value)
    {
        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv"), option, value);

        Assert.Equal(1, exit);
        Assert.Contains(option, error, StringComparison.Ordinal);
        Assert.Contains(value, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_without_quotes_or_par_yields_names_the_missing_option()
    {
        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"));

        Assert.Equal(1, exit);
        Assert.Contains("--quotes is required and missing; it wants: the quotes file", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_spread_group_names_the_option()
    {
        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv"), "--spread-group", "NOPE");

        Assert.Equal(1, exit);
        Assert.Contains("--spread-group: 'NOPE'", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Held_spread_group_without_quotes_exits_2_naming_the_group()
    {
        using var temp = new TempFolder();
        var instruments = temp.Write("instruments.csv", File.ReadAllLines(CliRun.Data("instruments.csv"))
            .Append("NWX-2031-01,Nowhere Works,NEW-GRP,XTS,4.000,2,30/360,2024-01-15,,2031-01-15,100,1"));
        var positions = temp.Write("positions.csv", File.ReadAllLines(CliRun.Data("positions.csv")).Append("CREDIT-IG,NWX-2031-01,1000000"));

        var (exit, _, error) = CliRun.Invoke("risk", "--instruments", instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--positions", positions);

        Assert.Equal(2, exit);
        Assert.Contains("spread group 'NEW-GRP'", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Extra_csv_column_exits_2_naming_the_file_and_line()
    {
        using var temp = new TempFolder();
        var instruments = temp.Edited("instruments.csv", line => line.StartsWith("id,", StringComparison.Ordinal) ? line + ",rating" : line);

        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", instruments, "--quotes", CliRun.Data("quotes-close.csv"));

        Assert.Equal(2, exit);
        Assert.Contains("instruments.csv, line 2, column 'rating'", error, StringComparison.Ordinal);
    }
}
