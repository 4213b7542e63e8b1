using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

/// <summary>
/// Limit statuses through the engine. The status rule (warning at 80%, breach at 100%, a 5% band to step down) is
/// the one in src/Monitor.Limits/README.md (common practice, no source). Limits are placed at run time relative
/// to the book's own DV01 so the test does not depend on the example market's exact figures.
/// </summary>
public sealed class RiskEngineLimitTests : IDisposable
{
    private const string Instrument = "VGB-2034-11";
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void A_crossing_changes_the_status_once_and_noise_inside_the_band_changes_nothing()
    {
        var (engine, limit, dv01PerFace, dv01) = Setup();
        var utilisations = new List<double>();
        var changes = new List<LimitStatusChange>();

        void BookTo(int version, double utilisation)
        {
            var face = (utilisation * limit - dv01) / dv01PerFace;
            var trade = new TradeInput("T-1", version, version == 1 ? TradeAction.New : TradeAction.Amend, "RATES-CORE", Instrument, face, 100, TestMarket.Now);
            var result = engine.ApplyTrade(trade, TestMarket.Now);
            changes.AddRange(result.StatusChanges.Where(c => c.LimitId == "t-dv01"));
            utilisations.Add(engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01] / limit);
        }

        BookTo(1, 0.81);
        var warning = Assert.Single(changes);
        Assert.Equal(LimitStatus.Within, warning.Previous);
        Assert.Equal(LimitStatus.Warning, warning.Current);
        Assert.Equal(0.81, warning.Utilisation, 1e-3);

        // Noise of +-2% around the 80% threshold, inside the 5% band: no further event.
        var version = 2;
        foreach (var u in new[] { 0.79, 0.81, 0.78, 0.82, 0.77, 0.80, 0.79 })
        {
            BookTo(version++, u);
        }
        Assert.Single(changes);

        // Below 75% the warning clears: exactly one more event. (Not 70%, the opening use: that trade's face would be
        // 0 or a rounding residue, depending on the last bits of the DV01.)
        BookTo(version, 0.69);
        Assert.Equal(2, changes.Count);
        Assert.Equal(LimitStatus.Within, changes[1].Current);
        Assert.Equal(0.69, utilisations[^1], 1e-3);
    }

    [Fact]
    public void A_breach_steps_down_only_below_the_band()
    {
        var (engine, limit, dv01PerFace, dv01) = Setup();
        var changes = new List<LimitStatusChange>();
        var version = 1;
        foreach (var u in new[] { 1.02, 0.97, 1.01, 0.93, 0.50 })
        {
            var face = (u * limit - dv01) / dv01PerFace;
            var trade = new TradeInput("T-1", version, version == 1 ? TradeAction.New : TradeAction.Amend, "RATES-CORE", Instrument, face, 100, TestMarket.Now);
            version++;
            changes.AddRange(engine.ApplyTrade(trade, TestMarket.Now).StatusChanges.Where(c => c.LimitId == "t-dv01"));
        }
        Assert.Equal([LimitStatus.Breach, LimitStatus.Warning, LimitStatus.Within], changes.Select(c => c.Current));
    }

    /// <summary>RATES-CORE at 70% of a DV01 limit written for the test; DV01 per unit face of the traded bond.</summary>
    private (RiskEngine Engine, double Limit, double Dv01PerFace, double Dv01) Setup()
    {
        var probe = TestMarket.OpenedEngine();
        var dv01 = probe.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];
        probe.ApplyTrade(new TradeInput("P-1", 1, TradeAction.New, "RATES-CORE", Instrument, 1_000_000, 100, TestMarket.Now), TestMarket.Now);
        var dv01PerFace = (probe.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01] - dv01) / 1_000_000;
        Assert.True(dv01PerFace > 0);
        var limit = dv01 / 0.7;
        var path = TestMarket.WriteLimits(_folder.Path,
            $"{{ \"id\": \"t-dv01\", \"scope\": \"book\", \"scopeId\": \"RATES-CORE\", \"measure\": \"dv01\", \"upper\": {TestMarket.Inv(limit)} }}");
        var engine = TestMarket.OpenedEngine(path);
        Assert.Equal(LimitStatus.Within, engine.Limits.StatusOf("t-dv01"));
        return (engine, limit, dv01PerFace, dv01);
    }
}
