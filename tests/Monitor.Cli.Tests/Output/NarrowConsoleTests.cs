using System.Text.RegularExpressions;
using Monitor.Cli.Output;
using Monitor.Cli.Tests.Support;
using Monitor.Cli.Verbs;

namespace Monitor.Cli.Tests.Output;

/// <summary>A table never breaks a number across lines, however narrow the console.</summary>
public partial class NarrowConsoleTests
{
    private static readonly string[] Numbers = ["-13,176,965", "24,324.07", "1.8E-11", "-392.436", "0.000"];

    [Theory]
    [InlineData(200)]
    [InlineData(60)]
    [InlineData(30)]
    [InlineData(12)]
    public void Every_number_stays_on_one_line(int width)
    {
        using var writer = new StringWriter();
        var console = TableConsole.Create(writer, width);
        var table = TableConsole.Table("books: a title longer than a narrow console", "book", ">value", ">DV01", ">gap", ">level conv", ">zero", "gate");
        TableConsole.Row(table, "RATES-CURVE", Numbers[0], Numbers[1], Numbers[2], Numbers[3], Numbers[4], "PASSED (rmse <= 15, max <= 60 bp, >= 4 used)");

        TableConsole.Write(console, table);

        var text = writer.ToString();
        foreach (var number in Numbers)
        {
            Assert.Contains(number, text, StringComparison.Ordinal);
        }
        Assert.Contains("15,", text, StringComparison.Ordinal);
        Assert.Contains("60", text, StringComparison.Ordinal);
    }

    [Fact]
    public void A_wide_console_gets_the_table_and_a_narrow_one_plain_lines()
    {
        using var wide = new StringWriter();
        using var narrow = new StringWriter();
        foreach (var (writer, width) in new[] { (wide, 200), (narrow, 30) })
        {
            var table = TableConsole.Table("t", "book", ">value", ">DV01");
            TableConsole.Row(table, "RATES-CURVE", "-13,176,965", "24,324.07");
            TableConsole.Write(TableConsole.Create(writer, width), table);
        }

        Assert.Contains("╭", wide.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("╭", narrow.ToString(), StringComparison.Ordinal);
        Assert.Contains("    value: -13,176,965", narrow.ToString(), StringComparison.Ordinal);
        Assert.All(narrow.ToString().Split('\n'), line => Assert.True(line.TrimEnd().Length <= 30, line));
    }

    [Fact]
    public void Risk_tables_at_80_columns_keep_every_number_of_the_json_whole()
    {
        string[] args = ["risk", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv"), "--positions", CliRun.Data("positions.csv"), "--by", "book"];
        var (exit, wideText, error) = CliRun.Invoke(args);
        Assert.True(exit == 0, error);

        // The same document rendered at 80 columns: every number token of the 200-column rendering appears whole.
        using var writer = new StringWriter();
        var curves = MarketSnapshot.Load(
            Monitor.Files.InstrumentFile.Read(CliRun.Data("instruments.csv")).ToDictionary(b => b.Id, StringComparer.Ordinal),
            CliRun.Data("quotes-close.csv"), null, TimeSpan.FromHours(4));
        Assert.NotNull(curves);
        var document = RiskVerb.Compute(
            BookPositions.Load(CliRun.Data("positions.csv"), Monitor.Files.InstrumentFile.Read(CliRun.Data("instruments.csv")).ToDictionary(b => b.Id, StringComparer.Ordinal)),
            curves.Fit(Monitor.Analytics.Fitting.CurveModel.NelsonSiegel, new(5, 25, 6), new(15, 60, 4), ["INDUSTRIAL-BBB", "UTIL-A"]),
            withPositions: false);
        RiskTables.Write(TableConsole.Create(writer, 80), document);

        var narrowText = writer.ToString();
        foreach (Match number in NumberToken().Matches(wideText))
        {
            Assert.Contains(number.Value, narrowText, StringComparison.Ordinal);
        }
    }

    [GeneratedRegex(@"-?\d[\d,]*\.\d+(E-?\d+)?")]
    private static partial Regex NumberToken();
}
