using System.Text.Json;
using Monitor.Cli.Tests.Support;

namespace Monitor.Cli.Tests.Verbs;

public class ExplainVerbTests
{
    private static string[] Args(params string[] more) =>
    [
        "explain", "--instruments", CliRun.Data("instruments.csv"), "--positions", CliRun.Data("positions.csv"),
        "--from-quotes", CliRun.Data("quotes-open.csv"), "--to-quotes", CliRun.Data("quotes-close.csv"), .. more,
    ];

    [Theory]
    [InlineData(null)]
    [InlineData("2026-06-09")]
    public void Components_add_up_to_the_total_log_return_and_the_money_pnl(string? toDate)
    {
        var (exit, output, error) = CliRun.Invoke(toDate is null ? Args("--json") : Args("--json", "--to-date", toDate));

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var books = json.RootElement.GetProperty("books").EnumerateArray().ToArray();
        Assert.Equal(3, books.Length);
        foreach (var b in books)
        {
            var components = b.GetProperty("components").EnumerateArray().ToArray();
            Assert.Equal(new[] { "horizon", "base curve", "spread", "interaction" }, components.Select(c => c.GetProperty("name").GetString()!).ToArray());
            var v0 = b.GetProperty("v0").GetDouble();
            var v1 = b.GetProperty("v1").GetDouble();
            var total = b.GetProperty("totalReturnBp").GetDouble();
            // Domain primer, "Holding-period return decomposition": ln(V1/V0) = ln(Vh/V0) + ln(Vb/Vh) + ln(Vs/Vh) + ln(V1 Vh/(Vb Vs)), exact.
            Assert.Equal(1e4 * Math.Log(v1 / v0), total, 6);
            Assert.Equal(total, components.Sum(c => c.GetProperty("returnBp").GetDouble()), 6);
            Assert.Equal(v1 - v0, components.Sum(c => c.GetProperty("money").GetDouble()), 4);
            Assert.Equal(b.GetProperty("totalPnl").GetDouble(), v1 - v0, 4);
        }
    }

    [Fact]
    public void Factor_terms_explain_each_curve_move_up_to_a_small_residual()
    {
        var (_, output, _) = CliRun.Invoke(Args("--json", "--to-date", "2026-06-09"));
        using var json = JsonDocument.Parse(output);
        foreach (var b in json.RootElement.GetProperty("books").EnumerateArray())
        {
            foreach (var curve in new[] { b.GetProperty("base"), b.GetProperty("spread") }.Where(c => c.ValueKind != JsonValueKind.Null))
            {
                var actual = curve.GetProperty("actual").GetProperty("money").GetDouble();
                var terms = curve.GetProperty("terms").EnumerateArray().Sum(t => t.GetProperty("money").GetDouble());
                var shape = curve.GetProperty("shape").GetProperty("money").GetDouble();
                var residual = curve.GetProperty("residual").GetProperty("money").GetDouble();
                Assert.Equal(actual, terms + shape + residual, 4); // residual is defined as the rest
                // Second-order Taylor expansion in the factor moves: the remainder is third order, a small share of the move
                // for moves of tens of bp (domain primer; "level terms dominate" is common practice, no source).
                Assert.True(Math.Abs(residual) <= 0.02 * Math.Abs(actual), $"{b.GetProperty("book")}: residual {residual} of {actual}");
            }
        }
    }

    [Fact]
    public void Same_valuation_date_has_no_horizon_return_and_a_later_one_has_carry()
    {
        var (_, same, _) = CliRun.Invoke(Args("--json"));
        var (_, later, _) = CliRun.Invoke(Args("--json", "--to-date", "2026-06-09"));
        using var sameJson = JsonDocument.Parse(same);
        using var laterJson = JsonDocument.Parse(later);

        var core = sameJson.RootElement.GetProperty("books")[0];
        Assert.Equal("RATES-CORE", core.GetProperty("book").GetString());
        Assert.Equal(0.0, core.GetProperty("components")[0].GetProperty("money").GetDouble());
        // A long book of positive-yield bonds accrues value over a week on unchanged curves (carry; textbook fact).
        var coreLater = laterJson.RootElement.GetProperty("books")[0];
        Assert.True(coreLater.GetProperty("components")[0].GetProperty("money").GetDouble() > 0);
        Assert.Equal("2026-06-09", laterJson.RootElement.GetProperty("toDate").GetString());
    }

    [Fact]
    public void End_date_before_start_date_names_the_option()
    {
        var (exit, _, error) = CliRun.Invoke(Args("--to-date", "2026-05-29"));

        Assert.Equal(1, exit);
        Assert.Contains("--to-date: '2026-05-29'", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Table_shows_components_and_factor_terms()
    {
        var (exit, output, _) = CliRun.Invoke(Args());

        Assert.Equal(0, exit);
        foreach (var text in new[] { "holding period 2026-06-02 -> 2026-06-02", "horizon", "base curve", "interaction", "total ln(V1/V0)", "base level duration", "spread residual" })
        {
            Assert.Contains(text, output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Curve_tables_are_titled_by_start_and_end()
    {
        var (exit, output, error) = CliRun.Invoke(Args());

        Assert.True(exit == 0, error);
        var start = output.IndexOf("start curves (2026-06-02, --from-quotes)", StringComparison.Ordinal);
        var end = output.IndexOf("end curves (2026-06-02, --to-quotes)", StringComparison.Ordinal);
        Assert.True(start >= 0 && end > start, output);
    }

    [Fact]
    public void Missing_required_options_are_each_named_with_what_they_want()
    {
        var (exit, _, error) = CliRun.Invoke("explain", "--instruments", CliRun.Data("instruments.csv"));

        Assert.Equal(1, exit);
        Assert.Contains("--positions is required and missing; it wants: Positions file", error, StringComparison.Ordinal);
        Assert.Contains("--from-quotes is required and missing; it wants: Quotes at the start", error, StringComparison.Ordinal);
        Assert.Contains("--to-quotes is required and missing", error, StringComparison.Ordinal);
        Assert.DoesNotContain("--instruments is required", error, StringComparison.Ordinal);
    }
}
