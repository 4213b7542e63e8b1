using System.Text.Json;
using Monitor.Cli.Tests.Support;

namespace Monitor.Cli.Tests.Verbs;

public class FitVerbTests
{
    private static readonly string Instruments = CliRun.Data("instruments.csv");

    [Theory]
    [InlineData("quotes-open.csv")]
    [InlineData("quotes-close.csv")]
    public void Government_fit_to_the_example_quotes_is_well_under_one_bp(string quotes)
    {
        var (exit, output, error) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data(quotes), "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var curve = json.RootElement.GetProperty("curves")[0];
        Assert.Equal("government", curve.GetProperty("curve").GetString());
        // Invented data: the example prices were generated from a Nelson-Siegel curve plus about 0.4 cent of noise per
        // 100 face; 0.4 cent over price x duration (100 x 1.4..18 years) is at most ~0.3 bp of yield, so a Nelson-Siegel
        // fit must come out well under 1 bp (fact of the invented data, no published source).
        Assert.InRange(curve.GetProperty("rmseBp").GetDouble(), 0, 0.5);
        Assert.InRange(curve.GetProperty("maxAbsErrorBp").GetDouble(), 0, 1.0);
        Assert.True(curve.GetProperty("converged").GetBoolean());
        Assert.Equal(13, curve.GetProperty("usedCount").GetInt32());
        Assert.True(curve.GetProperty("gate").GetProperty("passed").GetBoolean());
        Assert.Equal(13, curve.GetProperty("residuals").GetArrayLength());
        // Spot date (T+1 business day) of the quotes' date 2026-06-01 (a Monday): common practice, no source.
        Assert.Equal("2026-06-02", json.RootElement.GetProperty("date").GetString());
    }

    [Fact]
    public void Residuals_agree_with_the_reported_rmse()
    {
        var (_, output, _) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--json");

        using var json = JsonDocument.Parse(output);
        var curve = json.RootElement.GetProperty("curves")[0];
        var used = curve.GetProperty("residuals").EnumerateArray().Where(r => r.GetProperty("used").GetBoolean()).Select(r => r.GetProperty("residualBp").GetDouble()).ToArray();
        // RMSE = sqrt(mean residual^2) over the instruments used (definition).
        Assert.Equal(Math.Sqrt(used.Average(r => r * r)), curve.GetProperty("rmseBp").GetDouble(), 9);
        Assert.Equal(used.Max(Math.Abs), curve.GetProperty("maxAbsErrorBp").GetDouble(), 9);
    }

    [Fact]
    public void Svensson_model_reports_six_parameters()
    {
        var (exit, output, error) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--model", "svensson", "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var curve = json.RootElement.GetProperty("curves")[0];
        Assert.Equal("svensson", curve.GetProperty("model").GetString());
        Assert.Equal(["b0", "b1", "b2", "b3", "tau1", "tau2"], curve.GetProperty("parameters").EnumerateObject().Select(p => p.Name).ToArray());
        Assert.InRange(curve.GetProperty("rmseBp").GetDouble(), 0, 0.5); // nests Nelson-Siegel: no worse (invented data)
    }

    [Fact]
    public void Par_yield_fit_recovers_the_points()
    {
        var (exit, output, error) = CliRun.Invoke("fit", "--par-yields", CliRun.Data("par-yields.csv"), "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        Assert.Equal("2026-06-01", json.RootElement.GetProperty("date").GetString());
        var curve = json.RootElement.GetProperty("curves")[0];
        Assert.Equal(11, curve.GetProperty("usedCount").GetInt32());
        // Invented par yields printed to 0.001% (0.1 bp); a smooth Nelson-Siegel curve through them fits to within that rounding.
        Assert.InRange(curve.GetProperty("rmseBp").GetDouble(), 0, 0.1);
        var tenYear = curve.GetProperty("points").EnumerateArray().Single(p => p.GetProperty("tenor").GetString() == "10Y");
        Assert.Equal(3.958, tenYear.GetProperty("parPct").GetDouble(), 2); // the file's 10Y point, percent
    }

    [Fact]
    public void Quote_for_an_unknown_instrument_is_left_out_as_unknown_not_an_error()
    {
        using var temp = new TempFolder();
        var quotes = temp.Write("quotes.csv", File.ReadAllLines(CliRun.Data("quotes-close.csv")).Append("ZZZ-2030-01,2026-06-01T16:30:00Z,,,99.5,,example-feed"));

        var (exit, output, error) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", quotes, "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var excluded = json.RootElement.GetProperty("curves")[0].GetProperty("excluded").EnumerateArray().Single();
        Assert.Equal("ZZZ-2030-01", excluded.GetProperty("id").GetString());
        Assert.Equal("Unknown", excluded.GetProperty("reason").GetString());
    }

    [Fact]
    public void Old_quote_is_left_out_as_stale_and_matured_bond_as_matured()
    {
        using var temp = new TempFolder();
        // 6.5 hours before the newest quote: older than the default 4 hours.
        var quotes = temp.Edited("quotes-close.csv", line => line.StartsWith("VGB-2027-11,", StringComparison.Ordinal) ? line.Replace("T16:30", "T10:00", StringComparison.Ordinal) : line);
        quotes = temp.Write("quotes2.csv", File.ReadAllLines(quotes).Append("VGB-2026-05,2026-06-01T16:30:00Z,,,100,,example-feed"));
        var instruments = temp.Write("instruments.csv", File.ReadAllLines(Instruments)
            .Append("VGB-2026-05,Republic of Veloria,,XTS,1.500,2,ACT/ACT-ICMA,2023-05-15,,2026-05-15,100,1"));

        var (exit, output, error) = CliRun.Invoke("fit", "--instruments", instruments, "--quotes", quotes, "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var curve = json.RootElement.GetProperty("curves")[0];
        var reasons = curve.GetProperty("excluded").EnumerateArray().ToDictionary(e => e.GetProperty("id").GetString()!, e => e.GetProperty("reason").GetString());
        Assert.Equal("Stale", reasons["VGB-2027-11"]);
        Assert.Equal("Matured", reasons["VGB-2026-05"]);
        Assert.Equal(12, curve.GetProperty("usedCount").GetInt32());

        var (_, loose, _) = CliRun.Invoke("fit", "--instruments", instruments, "--quotes", quotes, "--stale-after-hours", "8", "--json");
        using var looseJson = JsonDocument.Parse(loose);
        Assert.Equal(13, looseJson.RootElement.GetProperty("curves")[0].GetProperty("usedCount").GetInt32());
    }

    [Fact]
    public void Spread_group_fit_sits_on_the_government_curve()
    {
        var (exit, output, error) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--spread-group", "INDUSTRIAL-BBB", "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var curves = json.RootElement.GetProperty("curves");
        Assert.Equal(2, curves.GetArrayLength());
        var spread = curves[1];
        Assert.Equal("INDUSTRIAL-BBB", spread.GetProperty("curve").GetString());
        Assert.Equal("spread", spread.GetProperty("kind").GetString());
        Assert.Equal(4, spread.GetProperty("usedCount").GetInt32());
        Assert.Contains("g0", spread.GetProperty("parameters").EnumerateObject().Select(p => p.Name));
        // Invented credit bonds quoted well above the government curve: the fitted spread is positive at every tenor.
        Assert.All(spread.GetProperty("points").EnumerateArray(), p => Assert.True(p.GetProperty("spreadBp").GetDouble() > 0));
    }

    [Fact]
    public void Thin_spread_group_gets_a_flat_spread_and_fails_the_gate_with_exit_4()
    {
        // UTIL-A has 3 bonds in the examples, fewer than the 4 Nelson-Siegel parameters.
        var (exit, output, _) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--spread-group", "UTIL-A", "--json");

        Assert.Equal(4, exit);
        using var json = JsonDocument.Parse(output);
        var spread = json.RootElement.GetProperty("curves")[1];
        Assert.False(spread.GetProperty("gate").GetProperty("passed").GetBoolean());
        Assert.Contains(spread.GetProperty("gate").GetProperty("reasons").EnumerateArray(), r => r.GetString()!.Contains("at least 4", StringComparison.Ordinal));
        Assert.Contains(spread.GetProperty("notes").EnumerateArray(), n => n.GetString()!.Contains("flat spread", StringComparison.Ordinal));
        Assert.Equal(0.0, spread.GetProperty("parameters").GetProperty("g1").GetDouble());

        var (lenient, _, _) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--spread-group", "UTIL-A", "--spread-min-quotes", "3");
        Assert.Equal(0, lenient);
    }

    [Fact]
    public void Tight_gate_fails_the_government_curve()
    {
        var (exit, output, _) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--base-max-rmse-bp", "0.001");

        Assert.Equal(4, exit);
        Assert.Contains("FAILED", output, StringComparison.Ordinal);
        Assert.Contains("exceeds the limit of 0.00 bp", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Table_shows_parameters_report_residuals_and_gate()
    {
        var (exit, output, _) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"));

        Assert.Equal(0, exit);
        foreach (var text in new[] { "government curve", "b0", "tau", "RMSE", "iterations", "exit reason", "VGB-2056-05", "PASSED", "quotes left out: none" })
        {
            Assert.Contains(text, output, StringComparison.Ordinal);
        }
    }

    [Theory]
    [InlineData("1..30", 30)]
    [InlineData("1,2,5,10,30", 5)]
    [InlineData("3M,1..3,10Y", 5)]
    public void Tenors_the_user_asks_for_are_printed_and_the_year_basis_is_stated(string tenors, int count)
    {
        var (exit, output, error) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--tenors", tenors, "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var points = json.RootElement.GetProperty("curves")[0].GetProperty("points").EnumerateArray().Select(p => p.GetProperty("years").GetDouble()).ToArray();
        Assert.Equal(count, points.Length);
        Assert.Equal(points.Order().ToArray(), points);
        // Curve time is ACT/365F years from the valuation date (DEVELOPERS.md, Conventions: CurveTime).
        Assert.Equal("ACT/365F years from the valuation date 2026-06-02", json.RootElement.GetProperty("yearBasis").GetString());

        var (_, table, _) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--tenors", tenors);
        Assert.Contains("curve time: ACT/365F years from the valuation date 2026-06-02", table, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("1..")]
    [InlineData("30..1")]
    [InlineData("ten")]
    [InlineData("0")]
    public void Bad_tenors_are_refused_naming_the_option(string tenors)
    {
        var (exit, _, error) = CliRun.Invoke("fit", "--instruments", Instruments, "--quotes", CliRun.Data("quotes-close.csv"), "--tenors", tenors);

        Assert.Equal(1, exit);
        Assert.StartsWith($"--tenors: '{tenors}'", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Par_yield_fit_marks_the_points_it_left_out()
    {
        using var temp = new TempFolder();
        // The 2Y point blank: not published that day (as the Treasury file leaves 2M and 4M blank before 2018).
        var par = temp.Edited("par-yields.csv", line => line.Contains(",2Y,", StringComparison.Ordinal) ? line[..(line.LastIndexOf(',') + 1)] : line);

        var (exit, output, error) = CliRun.Invoke("fit", "--par-yields", par, "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var residuals = json.RootElement.GetProperty("curves")[0].GetProperty("residuals").EnumerateArray().ToArray();
        var twoYear = residuals.Single(r => r.GetProperty("id").GetString() == "2Y");
        Assert.False(twoYear.GetProperty("used").GetBoolean());
        Assert.Equal(JsonValueKind.Null, twoYear.GetProperty("yieldPct").ValueKind);
        Assert.Equal(10, residuals.Count(r => r.GetProperty("used").GetBoolean()));

        var (_, table, _) = CliRun.Invoke("fit", "--par-yields", par);
        var row = table.Split('\n').Single(l => l.Contains(" 2Y ", StringComparison.Ordinal) && l.Contains("left out", StringComparison.Ordinal));
        Assert.Contains("left out: no published yield", row, StringComparison.Ordinal);
    }

    [Fact]
    public void Par_yield_fit_has_its_own_gate()
    {
        var (exit, output, error) = CliRun.Invoke("fit", "--par-yields", CliRun.Data("par-yields.csv"), "--base-max-rmse-bp", "0.0001", "--json");

        Assert.True(exit == 0, error); // the bond-fit gate does not apply to a par-yield fit
        using var json = JsonDocument.Parse(output);
        var gate = json.RootElement.GetProperty("curves")[0].GetProperty("gate");
        Assert.Equal(10, gate.GetProperty("maxRmseBp").GetDouble()); // GateOptions.ParYieldDefaults
        Assert.Equal(30, gate.GetProperty("maxAbsErrorBp").GetDouble());

        var (strict, _, _) = CliRun.Invoke("fit", "--par-yields", CliRun.Data("par-yields.csv"), "--par-max-rmse-bp", "0.0001");
        Assert.Equal(4, strict);
    }
}
