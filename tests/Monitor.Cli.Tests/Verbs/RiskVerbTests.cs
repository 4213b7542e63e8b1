using System.Text.Json;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Market;
using Monitor.Cli.Tests.Support;
using Monitor.Files;

namespace Monitor.Cli.Tests.Verbs;

public class RiskVerbTests
{
    private static string[] Args(params string[] more) =>
    [
        "risk", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv"),
        "--positions", CliRun.Data("positions.csv"), .. more,
    ];

    [Fact]
    public void Book_figures_from_merged_cash_flows_equal_the_sum_of_the_positions()
    {
        var (exit, output, error) = CliRun.Invoke(Args("--json"));

        Assert.True(exit == 0, error);
        using var json = JsonDocument.Parse(output);
        var positions = json.RootElement.GetProperty("positions").EnumerateArray().ToArray();
        var books = json.RootElement.GetProperty("books").EnumerateArray().ToArray();
        Assert.Equal(13, positions.Length);
        Assert.Equal(new[] { "RATES-CORE", "RATES-CURVE", "CREDIT-IG" }, books.Select(b => b.GetProperty("book").GetString()!).ToArray());
        foreach (var book in books)
        {
            var id = book.GetProperty("book").GetString();
            var held = positions.Where(p => p.GetProperty("book").GetString() == id).Select(p => p.GetProperty("exposures")).ToArray();
            var total = book.GetProperty("exposures");
            // Exposures are linear in the cash flows (domain primer, "Factor durations"): book = sum of positions, to rounding.
            foreach (var figure in MoneyFigures(total))
            {
                var sum = held.Sum(p => Figure(p, figure.Path));
                Assert.True(Math.Abs(figure.Value - sum) <= 1e-9 * Math.Max(1, Math.Abs(sum)), $"{id} {figure.Path}: book {figure.Value}, positions {sum}");
            }
            Assert.Equal(held.Length, book.GetProperty("positions").GetInt32());
            Assert.InRange(book.GetProperty("maxAbsDifference").GetDouble(), 0, 1e-6);
        }
    }

    [Fact]
    public void Curve_values_the_government_positions_at_their_quoted_dirty_prices()
    {
        var (_, output, _) = CliRun.Invoke(Args("--json"));
        using var json = JsonDocument.Parse(output);
        var bonds = InstrumentFile.Read(CliRun.Data("instruments.csv")).ToDictionary(b => b.Id);
        var quotes = QuoteFile.Read(CliRun.Data("quotes-close.csv")).ToDictionary(q => q.InstrumentId);
        var valuationDate = new DateOnly(2026, 6, 2);

        foreach (var p in json.RootElement.GetProperty("positions").EnumerateArray().Where(p => p.GetProperty("spreadGroup").ValueKind == JsonValueKind.Null))
        {
            var id = p.GetProperty("instrumentId").GetString()!;
            var face = p.GetProperty("faceAmount").GetDouble();
            var priced = BondFitInputs.Price(bonds[id], quotes[id], valuationDate);
            var value = p.GetProperty("exposures").GetProperty("value").GetDouble();
            // The fitted curve reprices its own quotes to well under 1 bp of yield (see FitVerbTests), i.e. to under
            // duration x 1 bp ~ 0.2% of price for these bonds: the curve value of a lag-1 bond at the valuation date
            // (its settlement date) is within that of face/100 x the quoted dirty price.
            Assert.Equal(1.0, value / (face / 100 * priced.DirtyPrice), 3);
        }
    }

    [Fact]
    public void Sign_convention_long_gains_when_rates_fall_and_government_bonds_have_no_spread_risk()
    {
        var (_, output, _) = CliRun.Invoke(Args("--json"));
        using var json = JsonDocument.Parse(output);
        foreach (var p in json.RootElement.GetProperty("positions").EnumerateArray())
        {
            var e = p.GetProperty("exposures");
            var sign = Math.Sign(p.GetProperty("faceAmount").GetDouble());
            // FactorExposures docs: money per bp is the money lost on a 1 bp rise, positive for a long; DV01 = base level money per bp.
            Assert.Equal(sign, Math.Sign(e.GetProperty("dv01").GetDouble()));
            Assert.Equal(e.GetProperty("dv01").GetDouble(), e.GetProperty("baseMoneyPerBp").GetProperty("level").GetDouble(), 9);
            Assert.True(e.GetProperty("baseDuration").GetProperty("level").GetDouble() > 0);
            if (p.GetProperty("spreadGroup").ValueKind == JsonValueKind.Null)
            {
                Assert.Equal(0.0, e.GetProperty("spreadMoneyPerBp").GetProperty("level").GetDouble());
            }
            else
            {
                // On z_base + s the base and spread level loadings are both 1: equal level exposures (FactorExposures docs).
                Assert.Equal(e.GetProperty("dv01").GetDouble(), e.GetProperty("spreadMoneyPerBp").GetProperty("level").GetDouble(), 6);
            }
        }
    }

    [Fact]
    public void By_book_leaves_the_positions_out()
    {
        var (exit, output, _) = CliRun.Invoke(Args("--json", "--by", "book"));

        Assert.Equal(0, exit);
        using var json = JsonDocument.Parse(output);
        Assert.Equal(JsonValueKind.Null, json.RootElement.GetProperty("positions").ValueKind);
        Assert.Equal(3, json.RootElement.GetProperty("books").GetArrayLength());
    }

    [Fact]
    public void Table_shows_positions_books_and_the_aggregation_check()
    {
        var (exit, output, _) = CliRun.Invoke(Args());

        Assert.Equal(0, exit);
        foreach (var text in new[] { "valuation date 2026-06-02", "KWS-2035-03", "CREDIT-IG", "DV01", "base slope", "spread curvature", "|book - sum|", "C level" })
        {
            Assert.Contains(text, output, StringComparison.Ordinal);
        }
    }

    private static IEnumerable<(string Path, double Value)> MoneyFigures(JsonElement e)
    {
        yield return ("value", e.GetProperty("value").GetDouble());
        yield return ("dv01", e.GetProperty("dv01").GetDouble());
        yield return ("levelMoneyConvexity", e.GetProperty("levelMoneyConvexity").GetDouble());
        foreach (var group in new[] { "baseMoneyPerBp", "spreadMoneyPerBp" })
        {
            foreach (var f in e.GetProperty(group).EnumerateObject())
            {
                yield return ($"{group}.{f.Name}", f.Value.GetDouble());
            }
        }
    }

    private static double Figure(JsonElement e, string path)
    {
        foreach (var part in path.Split('.'))
        {
            e = e.GetProperty(part);
        }
        return e.GetDouble();
    }
}
