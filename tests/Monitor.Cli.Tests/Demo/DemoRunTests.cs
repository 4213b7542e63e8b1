using System.Globalization;
using System.Text.RegularExpressions;
using Monitor.Cli.Tests.Support;
using Monitor.Cli.Demo;
using Monitor.Service.Audit;

namespace Monitor.Cli.Tests.Demo;

/// <summary>
/// The whole demo in-process (service, in-memory bus, scenario driver) at high speed with plain output, run once by
/// <see cref="DemoRunFixture"/>. The expected events are facts of our own scenario script (DemoScenario.Trades
/// against config/demo/limits.json), not copied output: the large RATES-CURVE buy must breach the book's DV01 limit
/// and the cut must clear it.
/// </summary>
public sealed class DemoRunTests(DemoRunFixture run) : IClassFixture<DemoRunFixture>
{
    [Fact]
    public void The_day_publishes_at_least_one_warning_one_breach_and_one_clear()
    {
        var outcome = run.Outcome;

        Assert.False(outcome.Interrupted);
        Assert.True(outcome.Count(StatusChangeKind.Warning) >= 1, run.Output);
        Assert.True(outcome.Count(StatusChangeKind.Breach) >= 1, run.Output);
        Assert.True(outcome.Count(StatusChangeKind.Clear) >= 1, run.Output);
        Assert.Equal(DemoScenario.Trades.Count, outcome.Trades);
    }

    [Fact]
    public void The_large_trade_breaches_the_book_DV01_limit_and_the_cut_clears_it()
    {
        var changes = run.Outcome.Changes;

        var breach = Assert.Single(changes, c => c.Kind == StatusChangeKind.Breach);
        Assert.Equal("rates-curve-dv01", breach.Message.LimitId);
        Assert.Equal("TradeBooked", breach.Message.CauseMessageType);
        Assert.Equal(DemoScenario.At(DemoScenario.Trades[2].At), breach.Message.EventTime);
        var clear = Assert.Single(changes, c => c.Kind == StatusChangeKind.Clear && c.Message.LimitId == "rates-curve-dv01");
        Assert.Equal("breach", clear.Message.PreviousStatus);
        Assert.Equal(DemoScenario.At(DemoScenario.Trades[3].At), clear.Message.EventTime);
        // The officer reads the trade's id, not an internal message type (issue 11).
        Assert.Equal($"after trade {DemoScenario.Trades[2].TradeId}", breach.Cause);
        Assert.Contains($"after trade {DemoScenario.Trades[3].TradeId}", run.Output, StringComparison.Ordinal);
        Assert.DoesNotContain("TradeBooked", run.Output, StringComparison.Ordinal);
    }

    [Fact]
    public void The_figures_the_README_states_for_every_run_are_those_of_a_real_run()
    {
        // Issue 11: the README's demo figures drifted; here they are read from the README and compared with the run.
        var readme = string.Join(" ", File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Examples", "ROOT-README.md")));
        var figures = Regex.Match(readme,
            @"Every run: (?<quotes>[\d,]+) quotes and (?<trades>\d+) trades through the bus; (?<warnings>\d+) warnings, (?<breaches>\d+) breach \((?<from>\d\d:\d\d) to (?<to>\d\d:\d\d) simulated\),\s+(?<clears>\d+) clears");
        Assert.True(figures.Success, "the README's demo paragraph no longer states the figures of every run");
        int Read(string name) => int.Parse(figures.Groups[name].Value.Replace(",", string.Empty, StringComparison.Ordinal), CultureInfo.InvariantCulture);
        var outcome = run.Outcome;
        Assert.Equal(Read("quotes"), outcome.Quotes);
        Assert.Equal(Read("trades"), outcome.Trades);
        Assert.Equal(Read("warnings"), outcome.Count(StatusChangeKind.Warning));
        Assert.Equal(Read("breaches"), outcome.Count(StatusChangeKind.Breach));
        Assert.Equal(Read("clears"), outcome.Count(StatusChangeKind.Clear));
        var breach = Assert.Single(outcome.Changes, c => c.Kind == StatusChangeKind.Breach);
        Assert.Equal(figures.Groups["from"].Value, breach.Message.EventTime.ToString("HH:mm", CultureInfo.InvariantCulture));
        var clear = Assert.Single(outcome.Changes, c => c.Kind == StatusChangeKind.Clear && c.Message.LimitId == breach.Message.LimitId);
        Assert.Equal(figures.Groups["to"].Value, clear.Message.EventTime.ToString("HH:mm", CultureInfo.InvariantCulture));
        Assert.True(outcome.Verification.Intact);
    }

    [Fact]
    public void The_exposure_log_verifies_intact()
    {
        Assert.True(run.Outcome.Verification.Intact);
        // Checked again here, independently of the demo's own check.
        // Under the run's own throw-away key (in the work folder, outside the log folder), against its checkpoints.
        Assert.False(Monitor.Service.Storage.RecordOptions.IsInside(run.Outcome.KeyFile, run.Outcome.ExposureLogFolder));
        var key = Monitor.Service.Storage.RecordKey.FromText(File.ReadAllText(run.Outcome.KeyFile), run.Outcome.KeyFile);
        var again = ExposureLogVerifier.VerifyFolder(key, run.Outcome.ExposureLogFolder, checkpointFolder: run.Outcome.CheckpointFolder);
        Assert.True(again.Intact, string.Join("; ", again.Problems.Select(p => p.Detail)));
        Assert.True(again.Records > 0);
        Assert.True(again.AnchoredSeq > 0);
        Assert.False(ExposureLogVerifier.VerifyFolder(TestKey.Value, run.Outcome.ExposureLogFolder).Intact); // another key: refused
        Assert.Contains("verify-log", run.Output, StringComparison.Ordinal);
        Assert.Contains("--key-file", run.Output, StringComparison.Ordinal);
    }

    [Fact]
    public void Quotes_priced_on_the_true_curve_fit_to_within_the_injected_noise()
    {
        // The driver adds 0.4 bp (one standard deviation) of yield noise to government quotes and rounds prices to
        // 0.001; a Nelson-Siegel fit of quotes generated from a Nelson-Siegel curve should leave residuals of that
        // order. 2 bp is a loose bound (five standard deviations), a fact of our own construction, no source.
        var government = Assert.Single(run.Outcome.Final.Curves, c => c.Curve == "government");

        Assert.True(government.Version > 1);
        Assert.InRange(government.RmseBp!.Value, 0.0, 2.0);
    }
}
