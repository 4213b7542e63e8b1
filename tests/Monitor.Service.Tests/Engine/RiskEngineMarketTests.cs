using Monitor.Analytics.Pricing;
using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Engine;

public sealed class RiskEngineMarketTests
{
    [Fact]
    public void Opening_quotes_fit_the_government_curve_and_value_the_rates_books()
    {
        var engine = TestMarket.Engine();
        foreach (var quote in TestMarket.OpenQuotes())
        {
            engine.AcceptQuote(quote, TestMarket.Now);
        }
        var result = engine.RefitDirtyCurves(TestMarket.Now);

        var government = result.Curves.Single(c => c.CurveKey == CurveKeyLabel.KeyOf(CurveKeyLabel.Government));
        Assert.True(government.Accepted, string.Join("; ", government.Verdict.Reasons));
        Assert.Equal(1, government.Version);
        Assert.Contains(result.Books, b => b.Book == "RATES-CORE");
        Assert.Contains(result.Books, b => b.Book == "RATES-CURVE");

        // Market value = sum of face x dirty price / 100 (definition; Fabozzi, Bond Markets, Analysis and Strategies,
        // 8th ed., ch. 2). The curve reprices the quoted bonds to within its fit error (RMSE well under 1 bp), so the
        // book's value matches its positions at the quoted mids to 1e-4 relative.
        var quotes = TestMarket.OpenQuotes().ToDictionary(q => q.InstrumentId, StringComparer.Ordinal);
        var book = engine.Books["RATES-CORE"];
        var expected = 0.0;
        foreach (var (id, face) in book.Positions)
        {
            var bond = engine.Instruments[id];
            var clean = quotes[id].CleanMid!.Value;
            var accrued = BondYield.Measures(bond, TestMarket.ValuationDate, BondYield.FromCleanPrice(bond, TestMarket.ValuationDate, clean)).AccruedInterest;
            expected += face * (clean + accrued) / 100.0;
        }
        Assert.Equal(expected, book.Exposures!.Totals[ExposureMeasure.MarketValue], expected * 1e-4);

        // A book long bonds loses value when yields rise: positive DV01 (sign convention of src/Monitor.Limits/README.md).
        Assert.True(book.Exposures.Totals[ExposureMeasure.Dv01] > 0);
    }

    [Fact]
    public void A_spread_group_with_too_few_bonds_waits_without_a_fit_and_without_stopping_the_other_curves()
    {
        // UTIL-A has three bonds in the example market, below the spread gate's minimum of four (SpreadMinQuotes; a
        // Nelson-Siegel curve has four parameters). Issue 11: no fit is tried, so no rejection is reported; the
        // government and INDUSTRIAL-BBB curves are still fitted, and the book holding UTIL-A waits for its curve.
        var engine = TestMarket.Engine();
        foreach (var quote in TestMarket.OpenQuotes())
        {
            engine.AcceptQuote(quote, TestMarket.Now);
        }
        var result = engine.RefitDirtyCurves(TestMarket.Now);

        Assert.DoesNotContain(result.Curves, c => c.CurveKey == "UTIL-A");
        Assert.True(Assert.Single(result.Curves, c => c.CurveKey == "INDUSTRIAL-BBB").Accepted);
        Assert.Contains("CREDIT-IG", result.BooksAwaitingCurves);
        Assert.Empty(engine.DirtyCurves());
    }

    [Fact]
    public void The_first_quote_of_the_day_tries_no_fit()
    {
        var engine = TestMarket.Engine();
        engine.AcceptQuote(TestMarket.OpenQuotes().First(q => q.InstrumentId.StartsWith("VGB", StringComparison.Ordinal)), TestMarket.Now);

        var result = engine.RefitDirtyCurves(TestMarket.Now);

        Assert.Empty(result.Curves);
        Assert.Empty(engine.DirtyCurves());
    }

    [Fact]
    public void A_fit_failing_the_gate_keeps_the_last_good_curve()
    {
        var engine = TestMarket.OpenedEngine();
        var before = engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01];
        var fitted = engine.Curves[CurveKeyLabel.KeyOf(CurveKeyLabel.Government)].Current;

        // Corrupt the snapshot: every other government bond 8 points off. No smooth curve fits that to 5 bp.
        var later = TestMarket.Now.AddMinutes(1);
        var quotes = TestMarket.Shifted(TestMarket.OpenQuotes().Where(q => q.InstrumentId.StartsWith("VGB", StringComparison.Ordinal)).ToArray(), 0, later);
        for (var i = 0; i < quotes.Count; i++)
        {
            var q = quotes[i];
            engine.AcceptQuote(i % 2 == 0 ? q : new(q.InstrumentId, later, null, null, q.Mid!.Value - 8, null, "bad-feed"), later);
        }
        var result = engine.RefitDirtyCurves(later);

        var government = Assert.Single(result.Curves, c => CurveKeyLabel.Of(c.CurveKey) == CurveKeyLabel.Government);
        Assert.False(government.Accepted);
        Assert.NotEmpty(government.Verdict.Reasons);
        Assert.Equal(1, government.Version);
        var curve = engine.Curves[CurveKeyLabel.KeyOf(CurveKeyLabel.Government)];
        Assert.Same(fitted, curve.Current);
        Assert.Equal(1, curve.Version);
        Assert.True(curve.LastFitRejected);
        Assert.Empty(result.Books);
        Assert.Equal(before, engine.Books["RATES-CORE"].Exposures!.Totals[ExposureMeasure.Dv01]);
    }

    [Fact]
    public void Par_yields_configured_as_the_valuation_source_fit_the_government_curve_and_revalue_books()
    {
        var options = TestMarket.Options();
        options.ValuationCurveSource = ValuationCurveSource.ParYields;
        var engine = EngineFactory.Create(options, new ManualClock(TestMarket.Now));
        var points = Monitor.Files.ParYieldFile.Read(TestMarket.Data("par-yields.csv")).Single().Points
            .Select(p => (Monitor.Analytics.Fitting.ParYieldCurveFitter.TenorLabel(p.TenorYears), p.ParYield!.Value)).ToArray();

        var result = engine.ApplyParYields(CurveKeyLabel.Government, TestMarket.Now, points, TestMarket.Now);

        Assert.True(Assert.Single(result.Curves).Accepted);
        var curve = engine.Curves[CurveKeyLabel.KeyOf(CurveKeyLabel.Government)].Curve!;
        // The fitted curve gives back the published 10Y par yield (ParYield.Compute is par = (1 - DF(T)) / annuity,
        // semiannual; Fabozzi, Bond Markets, 8th ed., ch. 5) to within the gate's 5 bp RMSE.
        Assert.Equal(0.03958, Monitor.Analytics.Curves.ParYield.Compute(curve, 10.0), 0.0005);
        Assert.Contains(result.Books, b => b.Book == "RATES-CORE");

        // Government bond quotes then fit their own reference curve: the valuation curve does not flip back to them.
        foreach (var quote in TestMarket.OpenQuotes().Where(q => q.InstrumentId.StartsWith("VGB", StringComparison.Ordinal)))
        {
            engine.AcceptQuote(quote, TestMarket.Now);
        }
        var bonds = engine.RefitDirtyCurves(TestMarket.Now);
        Assert.Equal(CurveKeyLabel.GovernmentBonds, Assert.Single(bonds.Curves, c => c.Accepted).CurveKey);
        Assert.Same(curve, engine.Curves[CurveKeyLabel.KeyOf(CurveKeyLabel.Government)].Curve);
        Assert.Empty(bonds.Books);
    }

    [Fact]
    public void Par_yields_fit_their_own_reference_curve_and_leave_the_bond_fitted_valuation_curve_alone()
    {
        var engine = TestMarket.OpenedEngine();
        var government = engine.Curves[CurveKeyLabel.KeyOf(CurveKeyLabel.Government)];
        var (fitted, version) = (government.Current, government.Version);
        var points = Monitor.Files.ParYieldFile.Read(TestMarket.Data("par-yields.csv")).Single().Points
            .Select(p => (Monitor.Analytics.Fitting.ParYieldCurveFitter.TenorLabel(p.TenorYears), p.ParYield!.Value)).ToArray();

        var result = engine.ApplyParYields(CurveKeyLabel.Government, TestMarket.Now, points, TestMarket.Now);

        var outcome = Assert.Single(result.Curves);
        Assert.True(outcome.Accepted);
        Assert.Equal(CurveKeyLabel.GovernmentPar, outcome.CurveKey);
        Assert.Equal(1, engine.Reference.Version);
        Assert.Same(fitted, government.Current); // the valuation curve did not flip to the par-yield fit
        Assert.Equal(version, government.Version);
        Assert.Empty(result.Books);
        Assert.DoesNotContain(CurveKeyLabel.GovernmentPar, engine.CurvesInUse(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("UTIL-A", "10Y", 0.04, "curveId")]
    [InlineData("government", "10X", 0.04, "points[0].tenor")]
    [InlineData("government", "10Y", double.NaN, "points[0].parYield")]
    [InlineData("government", "10Y", 4.5, "points[0].parYield")]
    public void Bad_par_yields_are_rejected_naming_the_field(string curveId, string tenor, double parYield, string field)
    {
        var engine = TestMarket.OpenedEngine();
        var before = EngineState.Of(engine);
        var ex = Assert.Throws<Monitor.Service.Messaging.MessageRejectedException>(() =>
            engine.ApplyParYields(curveId, TestMarket.Now, [(tenor, parYield)], TestMarket.Now));
        Assert.Equal(field, ex.Field);
        Assert.Equal(before, EngineState.Of(engine));
    }
}
