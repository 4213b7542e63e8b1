using FsCheck.Xunit;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Tests.Risk;

/// <summary>
/// The batch fast paths (instrument rows + holdings; date-merged ledgers into a <see cref="BookRiskMatrix"/>) against
/// the position-by-position reference <see cref="PositionRisk"/>. Identity tested: exposures are linear in the cash
/// flows (primer, "Everything above is linear in the cash flows"), so a book's figures are the sum of its positions'
/// figures whichever way the flows are grouped (by instrument, by date, or not at all).
/// </summary>
public class HoldingsRiskPropertyTests
{
    private static readonly string?[] Keys = [null, "", "group-a", "group-b"];

    private sealed record Instrument(string? Key, CashFlow[] Flows);

    private sealed record World(
        IFactorCurve BaseCurve,
        Dictionary<string, IFactorCurve> Spreads,
        CashFlowDateIndex Dates,
        InstrumentCashFlowTable Table,
        List<Instrument> Instruments,
        List<(BookHoldings Holdings, BookCashFlowLedger Ledger, List<(int Instrument, double Quantity)> Trades)> Books);

    private static World MakeWorld(int seed)
    {
        var rng = new Random(seed);
        var svensson = rng.Next(2) == 0;
        var baseCurve = RiskTestData.Curve(RiskTestData.BaseParameters(rng, svensson));
        var spreads = new Dictionary<string, IFactorCurve>
        {
            ["group-a"] = RiskTestData.Curve(RiskTestData.SpreadParameters(rng)),
            // A Svensson spread next to a Nelson-Siegel one: the common layout takes the wider of the two.
            ["group-b"] = RiskTestData.Curve(rng.Next(2) == 0 ? RiskTestData.SpreadParameters(rng) : RiskTestData.BaseParameters(rng, svensson: true)),
        };
        var dates = new CashFlowDateIndex();
        var table = new InstrumentCashFlowTable(dates);
        var instruments = new List<Instrument>();
        for (var i = rng.Next(1, 15); i > 0; i--)
        {
            var ins = new Instrument(Keys[rng.Next(Keys.Length)], RiskTestData.RandomBond(rng));
            instruments.Add(ins);
            Assert.Equal(instruments.Count - 1, table.Register(ins.Key, ins.Flows));
        }
        var books = new List<(BookHoldings, BookCashFlowLedger, List<(int, double)>)>();
        for (var b = rng.Next(1, 6); b > 0; b--)
        {
            var holdings = new BookHoldings();
            var ledger = new BookCashFlowLedger(dates);
            var trades = new List<(int, double)>();
            for (var t = rng.Next(0, 20); t > 0; t--)
            {
                var i = rng.Next(instruments.Count);
                var quantity = rng.Next(-20, 40) * 2_500.0 + 10.0;
                holdings.Add(i, quantity);
                ledger.Add(instruments[i].Key, instruments[i].Flows, quantity);
                trades.Add((i, quantity));
                if (rng.Next(4) == 0)
                {
                    // An undone trade (sell what was just bought) leaves no trace.
                    holdings.Remove(i, quantity);
                    ledger.Remove(instruments[i].Key, instruments[i].Flows, quantity);
                    trades.RemoveAt(trades.Count - 1);
                }
            }
            books.Add((holdings, ledger, trades));
        }
        return new World(baseCurve, spreads, dates, table, instruments, books);
    }

    private static (FactorExposures Reference, FactorExposures Gross) Reference(World w, List<(int Instrument, double Quantity)> trades)
    {
        var reference = FactorExposures.Zero(w.BaseCurve.FactorCount, 0);
        var gross = FactorExposures.Zero(w.BaseCurve.FactorCount, 0);
        foreach (var (i, quantity) in trades)
        {
            var ins = w.Instruments[i];
            var spread = CurveKey.IsGovernment(ins.Key) ? null : w.Spreads[ins.Key!];
            var e = PositionRisk.Compute(ins.Flows, RiskTestData.ValuationDate, w.BaseCurve, spread, quantity);
            reference = reference.Plus(e);
            gross = gross.Plus(e.Scale(Math.Sign(quantity)));
        }
        return (reference, gross);
    }

    [Property(MaxTest = 40)]
    public void Holdings_on_instrument_rows_equal_the_sum_of_position_risks(int seed)
    {
        // Tolerance 1e-9 of the gross scale: same terms summed in a different order (rounding only).
        var w = MakeWorld(seed);
        var grid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads);
        var full = HoldingsRiskCalculator.ComputeAll(w.Books.Select(b => b.Holdings).ToList(),
            InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Full, maxDegreeOfParallelism: 2), maxDegreeOfParallelism: 2);
        // The durations pass on a full grid and on a durations-only grid.
        var light = HoldingsRiskCalculator.ComputeAll(w.Books.Select(b => b.Holdings).ToList(),
            InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Durations));
        var lightGrid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads, RiskDepth.Durations);
        var lighter = HoldingsRiskCalculator.ComputeAll(w.Books.Select(b => b.Holdings).ToList(),
            InstrumentRiskRows.Build(w.Table, lightGrid, RiskDepth.Durations));
        // And on a grid evaluated only where instruments have flows (spread zero rate taken from its loadings).
        var onlyUsed = CurveGrid.BuildForInstruments(w.Table, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads, RiskDepth.Full);
        var sparse = HoldingsRiskCalculator.ComputeAll(w.Books.Select(b => b.Holdings).ToList(),
            InstrumentRiskRows.Build(w.Table, onlyUsed, RiskDepth.Full));
        for (var b = 0; b < w.Books.Count; b++)
        {
            var (reference, gross) = Reference(w, w.Books[b].Trades);
            RiskAssert.Close(reference, full.ToExposures(b), gross);
            RiskAssert.Close(reference, sparse.ToExposures(b), gross);
            RiskAssert.FirstMomentsClose(reference, light, b, gross);
            RiskAssert.FirstMomentsClose(reference, lighter, b, gross);
        }
    }

    [Property(MaxTest = 40)]
    public void Date_merged_ledgers_into_a_matrix_equal_the_single_book_pass(int seed)
    {
        // Same sums as BookRiskCalculator.Compute (spread groups summed factor by factor, BookRisk.Total), and the
        // position reference within rounding.
        var w = MakeWorld(seed);
        var grid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads);
        var ledgers = w.Books.Select(b => b.Ledger).ToList();
        var full = BookRiskCalculator.ComputeAll(ledgers, grid, RiskDepth.Full, maxDegreeOfParallelism: 2);
        var light = BookRiskCalculator.ComputeAll(ledgers, grid, RiskDepth.Durations);
        var lighter = BookRiskCalculator.ComputeAll(
            ledgers, CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads, RiskDepth.Durations), RiskDepth.Durations);
        // And on a grid evaluated only where instruments have flows (spread zero rate taken from its loadings).
        var onlyUsed = CurveGrid.BuildForInstruments(w.Table, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads, RiskDepth.Full);
        var sparse = HoldingsRiskCalculator.ComputeAll(w.Books.Select(b => b.Holdings).ToList(),
            InstrumentRiskRows.Build(w.Table, onlyUsed, RiskDepth.Full));
        for (var b = 0; b < w.Books.Count; b++)
        {
            var (reference, gross) = Reference(w, w.Books[b].Trades);
            RiskAssert.Close(reference, full.ToExposures(b), gross);
            RiskAssert.Close(reference, sparse.ToExposures(b), gross);
            RiskAssert.FirstMomentsClose(reference, light, b, gross);
            RiskAssert.FirstMomentsClose(reference, lighter, b, gross);
            RiskAssert.Close(BookRiskCalculator.Compute(ledgers[b], grid).Total, full.ToExposures(b), gross);
        }
    }

    [Fact]
    public void Many_books_split_over_threads_get_the_same_rows_as_one_thread_and_few_books_run_on_one()
    {
        // 4,000 books of up to 14 instruments at full depth (7+ vectors a row): past the serial threshold of 100,000
        // multiply-adds, so the default pass splits the books over threads.
        var w = MakeWorld(11);
        var grid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads);
        var rows = InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Full);
        var rng = new Random(11);
        var books = Enumerable.Range(0, 4_000).Select(_ =>
        {
            var holdings = new BookHoldings();
            for (var t = 0; t < 60; t++)
            {
                holdings.Add(rng.Next(w.Instruments.Count), rng.Next(-20, 40) * 2_500.0 + 10.0);
            }
            return holdings;
        }).ToList();

        var split = HoldingsRiskCalculator.ComputeAll(books, rows);
        var serial = HoldingsRiskCalculator.ComputeAll(books, rows, maxDegreeOfParallelism: 1);
        var few = HoldingsRiskCalculator.ComputeAll(books.Take(3).ToList(), rows);

        for (var b = 0; b < books.Count; b++)
        {
            Assert.True(split.Moments(b).SequenceEqual(serial.Moments(b)), $"book {b}");
            Assert.True(b >= 3 || few.Moments(b).SequenceEqual(serial.Moments(b)), $"book {b} of 3");
        }
    }

    [Fact]
    public void Rows_of_a_large_table_split_over_threads_equal_the_one_thread_rows_and_a_government_grid_built_inline()
    {
        // 400 instruments: past one chunk of 64, so the default build splits them; the grid has the two spread keys too.
        var w = MakeWorld(12);
        var rng = new Random(12);
        for (var i = 0; i < 400; i++)
        {
            w.Table.Register(Keys[rng.Next(Keys.Length)], RiskTestData.RandomBond(rng));
        }
        var grid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads);

        var split = InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Full);
        var serial = InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Full, maxDegreeOfParallelism: 1);

        Assert.True(split.Data.SequenceEqual(serial.Data));
        // A government-only grid (one key, filled on the calling thread) equals the government rows of the grid with spreads.
        var government = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, null);
        Assert.True(government.RowsFor(CurveKey.Government).Data.SequenceEqual(grid.RowsFor(CurveKey.Government).Data));
    }

    [Fact]
    public void A_matrix_is_reused_and_a_durations_pass_refuses_convexities()
    {
        var w = MakeWorld(7);
        var grid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads);
        var rows = InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Durations);
        var books = w.Books.Select(b => b.Holdings).ToList();
        var first = HoldingsRiskCalculator.ComputeAll(books, rows);
        Assert.Same(first, HoldingsRiskCalculator.ComputeAll(books, rows, first));
        Assert.Throws<InvalidOperationException>(() => first.ToExposures(0));
        Assert.Throws<ArgumentOutOfRangeException>(() => first.Value(books.Count));
        // A durations-only grid has no convexities: the full paths refuse it.
        var lightGrid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads, RiskDepth.Durations);
        Assert.Throws<ArgumentException>(() => BookRiskCalculator.Compute(w.Books[0].Ledger, lightGrid));
        Assert.Throws<ArgumentException>(() => InstrumentRiskRows.Build(w.Table, lightGrid, RiskDepth.Full));
        // A grid evaluated only where instruments have flows cannot price date-merged ledgers.
        var onlyUsed = CurveGrid.BuildForInstruments(w.Table, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads, RiskDepth.Full);
        Assert.False(onlyUsed.CoversAllDates);
        Assert.Throws<ArgumentException>(() => BookRiskCalculator.ComputeAll([w.Books[0].Ledger], onlyUsed, RiskDepth.Durations));
    }

    [Fact]
    public void Rows_must_be_rebuilt_after_new_instruments_and_dates()
    {
        var w = MakeWorld(11);
        var grid = CurveGrid.Build(w.Dates, RiskTestData.ValuationDate, w.BaseCurve, w.Spreads);
        var rows = InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Durations);
        var late = w.Table.Register(null, [new CashFlow(RiskTestData.ValuationDate.AddDays(12_345), 100.0)]);
        var holdings = new BookHoldings();
        holdings.Add(late, 1.0);
        Assert.Throws<InvalidOperationException>(() => HoldingsRiskCalculator.ComputeAll([holdings], rows));
        Assert.Throws<InvalidOperationException>(() => InstrumentRiskRows.Build(w.Table, grid, RiskDepth.Durations));
    }

    [Fact]
    public void Holdings_net_and_refuse_bad_input_with_the_field_named()
    {
        // Common practice, no source: a buy and an equal sell of one instrument leave no holding.
        var holdings = new BookHoldings();
        holdings.Add(3, 0.1);
        holdings.Add(3, 0.2);
        holdings.Remove(3, 0.3);
        Assert.Equal(0, holdings.Count);
        holdings.Add(5, 2.0);
        Assert.Equal(2.0, holdings.QuantityOf(5));
        Assert.Equal("quantity", Assert.Throws<ArgumentOutOfRangeException>(() => holdings.Add(1, double.NaN)).ParamName);
        Assert.Equal("instrument", Assert.Throws<ArgumentOutOfRangeException>(() => holdings.Add(-1, 1.0)).ParamName);
        var table = new InstrumentCashFlowTable(new CashFlowDateIndex());
        Assert.Throws<ArgumentException>(() => table.Register(null, [new CashFlow(RiskTestData.ValuationDate, double.NaN)]));
    }

    [Property(MaxTest = 40)]
    public void A_ledger_read_after_every_trade_equals_one_read_once_at_the_end(int seed)
    {
        // The compact view is patched in place for trades on known dates; it must equal a rebuild from scratch
        // (no source needed: two storages of the same sums). Equal exactly: each amount is the same float sum.
        var rng = new Random(seed);
        var dates = new CashFlowDateIndex();
        var eager = new BookCashFlowLedger(dates);
        var lazy = new BookCashFlowLedger(dates);
        var bonds = Enumerable.Range(0, 4).Select(_ => RiskTestData.RandomBond(rng)).ToArray();
        for (var t = 0; t < 30; t++)
        {
            var key = Keys[rng.Next(Keys.Length)];
            var flows = bonds[rng.Next(bonds.Length)];
            var scale = rng.Next(-5, 6) * 100.0;
            eager.Add(key, flows, scale);
            lazy.Add(key, flows, scale);
            _ = eager.GetSegment(key);
        }
        foreach (var key in lazy.CurveKeys)
        {
            var a = eager.GetSegment(key);
            var b = lazy.GetSegment(key);
            Assert.Equal(b.DateIndices.ToArray(), a.DateIndices.ToArray());
            Assert.Equal(b.Amounts.ToArray(), a.Amounts.ToArray());
        }
    }
}
