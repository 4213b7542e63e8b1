using System.Text.Json;
using Monitor.Cli.Tests.Support;

namespace Monitor.Cli.Tests.Verbs;

/// <summary>
/// <c>monitor bond</c> against 31 CFR Part 356, Appendix B ("Formulas and Tables"), section II, examples A, C and D:
/// published 6-decimal results, as quoted in tests/Monitor.Analytics.Tests/Pricing/TreasuryAppendixBTests.cs (source
/// named in tests/Monitor.Analytics.Tests/Data/README.md). Tolerance 5e-7: the published figures are rounded to 6 decimals.
/// </summary>
public class BondVerbTests
{
    private const double SixDecimals = 5e-7;

    // App. B, II.D: 9 1/2% 10-year note accruing from 15 Nov 1985, settling 29 Nov 1985, due 15 Nov 1995.
    private static readonly string[] ExampleD =
        ["bond", "--coupon-pct", "9.5", "--issue-date", "1985-11-15", "--maturity-date", "1995-11-15", "--settlement-date", "1985-11-29", "--convention", "treasury-auction", "--json"];

    private static JsonElement Run(params string[] args)
    {
        var (exit, output, error) = CliRun.Invoke(args);
        Assert.True(exit == 0, error);
        return JsonDocument.Parse(output).RootElement.Clone();
    }

    [Fact]
    public void Price_from_yield_reproduces_appendix_B_example_D()
    {
        var m = Run([.. ExampleD, "--from-yield", "9.54"]);

        // 31 CFR 356 App. B, II.D: yield 9.54%: accrued .367403, price 99.730918.
        Assert.Equal(99.730918, m.GetProperty("cleanPrice").GetDouble(), SixDecimals);
        Assert.Equal(0.367403, m.GetProperty("accruedInterest").GetDouble(), SixDecimals);
        Assert.Equal(99.730918 + 0.367403, m.GetProperty("dirtyPrice").GetDouble(), 2 * SixDecimals);
        Assert.Equal("treasury-auction", m.GetProperty("convention").GetString());
    }

    [Fact]
    public void Yield_from_price_reproduces_appendix_B_example_D()
    {
        var m = Run([.. ExampleD, "--from-price", "99.730918"]);

        // 31 CFR 356 App. B, II.D read backwards: price 99.730918 is the yield 9.54% (a price to 6 decimals pins the
        // yield to about 1e-5 percent: 5e-7 / (price x modified duration 6.3) per 100).
        Assert.Equal(9.54, m.GetProperty("yieldPct").GetDouble(), 1e-5);
        Assert.Equal("price", m.GetProperty("from").GetString());
    }

    [Theory]
    [InlineData("street")]
    [InlineData("treasury-auction")]
    [InlineData("Treasury-Auction")]
    public void Example_A_with_the_default_issue_date_is_the_same_in_both_conventions(string convention)
    {
        // 31 CFR 356 App. B, II.A: 8 3/4% 30-year bond issued 15 May 1990, due 15 May 2020, yield 8.84%: P = 99.057893.
        // Settling on a coupon date the stub is one whole period, so street and auction conventions agree (App. B
        // formula with r = s). The issue date is left to its default, the last coupon date on or before settlement.
        var m = Run("bond", "--coupon-pct", "8.75", "--maturity-date", "2020-05-15", "--settlement-date", "1990-05-15", "--from-yield", "8.84", "--convention", convention, "--json");

        Assert.Equal(99.057893, m.GetProperty("cleanPrice").GetDouble(), SixDecimals);
        Assert.Equal("1990-05-15", m.GetProperty("issueDate").GetString());
    }

    [Fact]
    public void Example_C_long_first_period_from_options()
    {
        // 31 CFR 356 App. B, II.C: 8 1/2% note issued 1 Mar 1990, due 15 May 1995, first coupon 15 Nov 1990, yield 8.53%: P = 99.805118.
        var m = Run("bond", "--coupon-pct", "8.5", "--issue-date", "1990-03-01", "--first-coupon-date", "1990-11-15", "--maturity-date", "1995-05-15",
            "--settlement-date", "1990-03-01", "--from-yield", "8.53", "--convention", "treasury-auction", "--json");

        Assert.Equal(99.805118, m.GetProperty("cleanPrice").GetDouble(), SixDecimals);
    }

    [Fact]
    public void Bond_by_id_from_an_instruments_file()
    {
        using var temp = new TempFolder();
        var instruments = temp.Write("instruments.csv", [
            "id,issuer,spread_group,currency,coupon_pct,frequency,day_count,issue_date,first_coupon_date,maturity_date,face,settlement_lag",
            "APPB-D,Test Treasury,,XTS,9.5,2,ACT/ACT-ICMA,1985-11-15,,1995-11-15,100,1",
        ]);

        var m = Run("bond", "--instruments", instruments, "--id", "APPB-D", "--settlement-date", "1985-11-29", "--from-yield", "9.54", "--convention", "treasury-auction", "--json");

        // 31 CFR 356 App. B, II.D, as above.
        Assert.Equal(99.730918, m.GetProperty("cleanPrice").GetDouble(), SixDecimals);
        Assert.Equal("APPB-D", m.GetProperty("id").GetString());
    }

    [Fact]
    public void Measures_agree_with_their_definitions()
    {
        var m = Run("bond", "--coupon-pct", "4.25", "--maturity-date", "2034-11-15", "--settlement-date", "2026-02-03", "--from-yield", "4.6", "--convention", "compounded", "--json");
        var (y, dirty, mac, mod, conv, dv01) = (m.GetProperty("yieldPct").GetDouble() / 100, m.GetProperty("dirtyPrice").GetDouble(),
            m.GetProperty("macaulayDuration").GetDouble(), m.GetProperty("modifiedDuration").GetDouble(), m.GetProperty("convexity").GetDouble(), m.GetProperty("dv01").GetDouble());

        // Every flow compounded: modified = Macaulay / (1 + y/f) (Fabozzi, Bond Markets, Analysis and Strategies, ch. 4).
        Assert.Equal(mac / (1 + (y / 2)), mod, 10);
        // DV01 = P(y - 1bp) - P(y) = P (D 1e-4 + C 1e-8 / 2) to second order (Taylor expansion; common practice).
        Assert.Equal(dirty * ((mod * 1e-4) + (conv * 1e-8 / 2)), dv01, 1e-8);
        Assert.Equal(dirty - m.GetProperty("accruedInterest").GetDouble(), m.GetProperty("cleanPrice").GetDouble(), 12);
    }

    [Fact]
    public void Table_output_names_every_measure()
    {
        var (exit, output, error) = CliRun.Invoke([.. ExampleD[..^1], "--from-yield", "9.54"]);

        Assert.True(exit == 0, error);
        foreach (var measure in new[] { "clean price", "accrued interest", "dirty price", "Macaulay duration", "modified duration", "convexity", "DV01", "PV01", "99.730918", "0.367403" })
        {
            Assert.Contains(measure, output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Missing_settlement_date_says_what_it_wants()
    {
        var (exit, _, error) = CliRun.Invoke("bond", "--coupon-pct", "9.5", "--maturity-date", "1995-11-15", "--from-yield", "9.54");

        Assert.Equal(1, exit);
        Assert.Contains("--settlement-date is required and missing; it wants: Settlement date YYYY-MM-DD", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Both_yield_and_price_is_refused_naming_the_options()
    {
        var (exit, _, error) = CliRun.Invoke([.. ExampleD, "--from-yield", "9.54", "--from-price", "99"]);

        Assert.Equal(1, exit);
        Assert.Contains("--from-price", error, StringComparison.Ordinal);
        Assert.Contains("--from-yield", error, StringComparison.Ordinal);
    }
}
