using System.Globalization;
using System.Text.Json;
using Monitor.Cli.Tests.Support;

namespace Monitor.Cli.Tests.Verbs;

/// <summary>
/// <c>monitor curve</c> reproduces published curves from their parameters: Gurkaynak, Sack and Wright (2006),
/// "The U.S. Treasury Yield Curve: 1961 to the Present", FEDS 2006-28, dataset feds200628
/// (Data/svensson-published-sample.csv, see Data/README.md).
/// </summary>
public class CurveVerbTests
{
    // The source rounds SVENY/SVENPY to 4 decimals (percent); 1e-9 absorbs the float error of the comparison.
    private const double SourceRounding = 5e-5 + 1e-9;

    public static TheoryData<string> Dates() => [.. Rows().Select(r => r[0])];

    private static IEnumerable<string[]> Rows() =>
        File.ReadLines(CliRun.Data("svensson-published-sample.csv")).Skip(1).Where(l => l.Length > 0).Select(l => l.Split(','));

    [Theory]
    [MemberData(nameof(Dates))]
    public void Published_Svensson_parameters_give_the_published_zero_and_par_yields(string date)
    {
        var row = Rows().Single(r => r[0] == date);
        // Columns: date, beta0..beta3 (percent), tau1, tau2 (years), zero_1y..zero_30y, par_1y..par_30y.
        var (exit, output, error) = CliRun.Invoke("curve", "--beta0", row[1], "--beta1", row[2], "--beta2", row[3], "--beta3", row[4],
            "--tau1", row[5], "--tau2", row[6], "--tenors", "1..30", "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        Assert.Equal("svensson", json.RootElement.GetProperty("model").GetString());
        var points = json.RootElement.GetProperty("points").EnumerateArray().ToArray();
        Assert.Equal(30, points.Length);
        for (var n = 1; n <= 30; n++)
        {
            var p = points[n - 1];
            Assert.Equal(n, p.GetProperty("years").GetDouble());
            // feds200628 SVENYnn (zero, continuously compounded) and SVENPYnn (par, semiannual), percent.
            Assert.Equal(double.Parse(row[6 + n], CultureInfo.InvariantCulture), p.GetProperty("zeroPct").GetDouble(), SourceRounding);
            Assert.Equal(double.Parse(row[36 + n], CultureInfo.InvariantCulture), p.GetProperty("parPct").GetDouble(), SourceRounding);
        }
    }

    [Fact]
    public void Nelson_Siegel_forward_is_the_published_forward_formula()
    {
        // Nelson and Siegel (1987), "Parsimonious Modeling of Yield Curves", J. Business 60(4), eq. (2):
        // f(m) = b0 + b1 exp(-m/tau) + b2 (m/tau) exp(-m/tau). Parameters invented.
        var (exit, output, error) = CliRun.Invoke("curve", "--beta0", "4.5", "--beta1", "-1.5", "--beta2", "2", "--tau", "1.8", "--tenors", "3M,1,2,5,10,30", "--json");

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        Assert.Equal("nelson-siegel", json.RootElement.GetProperty("model").GetString());
        foreach (var p in json.RootElement.GetProperty("points").EnumerateArray())
        {
            var m = p.GetProperty("years").GetDouble();
            var e = Math.Exp(-m / 1.8);
            Assert.Equal(4.5 - (1.5 * e) + (2 * (m / 1.8) * e), p.GetProperty("forwardPct").GetDouble(), 1e-10);
        }
    }

    [Fact]
    public void Half_a_Svensson_curve_is_refused_naming_the_missing_option()
    {
        var (exit, _, error) = CliRun.Invoke("curve", "--beta0", "4.5", "--beta1", "-1.5", "--beta2", "2", "--beta3", "1", "--tau1", "1.8");

        Assert.Equal(1, exit);
        Assert.Contains("--tau2", error, StringComparison.Ordinal);
        Assert.Contains("missing", error, StringComparison.Ordinal);
    }
}
