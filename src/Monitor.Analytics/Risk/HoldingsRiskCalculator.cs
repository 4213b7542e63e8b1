using System.Collections.Concurrent;
using System.Numerics;

namespace Monitor.Analytics.Risk;

/// <summary>
/// The fast path for many books: each book's whole exposures = sum over its holdings of quantity x
/// <see cref="InstrumentRiskRows"/> row, a few SIMD multiply-adds per holding, books split over threads, no allocation
/// (pass the previous <see cref="BookRiskMatrix"/> back in). Agrees with <see cref="PositionRisk"/> summed over the
/// positions and with <see cref="BookRiskCalculator"/> on the same flows merged by date (exposures are linear in the
/// cash flows).
/// </summary>
public static class HoldingsRiskCalculator
{
    /// <summary>
    /// Below this many vector multiply-adds (holdings x vectors a row) the pass runs on the calling thread: 1,000 books
    /// of 10 holdings is tens of microseconds of work, less than handing chunks to pool threads that, on a busy 2-core
    /// machine, may wait for a core (SmallBooksRefitBenchmarks, tests/Monitor.Benchmarks/README.md).
    /// </summary>
    private const long SerialBelowMultiplyAdds = 100_000;

    /// <summary>
    /// Exposures of every book of <paramref name="books"/> (row b of the result is books[b]). The books must not
    /// change during the call.
    /// </summary>
    /// <param name="books">Holdings of instruments of the table the rows were built from.</param>
    /// <param name="rows">Instrument rows on the current curves.</param>
    /// <param name="output">A matrix from an earlier call to overwrite, or null to allocate one.</param>
    /// <param name="maxDegreeOfParallelism">Threads to use (-1: the runtime's choice).</param>
    public static BookRiskMatrix ComputeAll(
        IReadOnlyList<BookHoldings> books, InstrumentRiskRows rows, BookRiskMatrix? output = null, int maxDegreeOfParallelism = -1)
    {
        ArgumentNullException.ThrowIfNull(books);
        ArgumentNullException.ThrowIfNull(rows);
        var n = books.Count;
        if (output is null || !output.Fits(n, rows.Layout))
        {
            output = new BookRiskMatrix(n, rows.BaseFactorCount, rows.SpreadFactorCount, rows.Depth);
        }
        var holdings = 0L;
        for (var b = 0; b < n; b++)
        {
            var book = books[b] ?? throw new ArgumentException($"books[{b}] is null.", nameof(books));
            book.CheckAgainst(rows.Count);
            holdings += book.Count;
        }
        var vectors = rows.Stride / Vector<double>.Count;
        var result = output;
        if (holdings * vectors < SerialBelowMultiplyAdds || maxDegreeOfParallelism == 1)
        {
            for (var b = 0; b < n; b++)
            {
                var book = books[b];
                RowAccumulator.Accumulate(book.Instruments, book.Quantities, rows.Data, rows.Stride, vectors, result.Row(b));
            }
            return output;
        }
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism };
        var chunk = Math.Max(1, n / (8 * Environment.ProcessorCount));
        Parallel.ForEach(Partitioner.Create(0, n, chunk), options, range =>
        {
            for (var b = range.Item1; b < range.Item2; b++)
            {
                var book = books[b];
                RowAccumulator.Accumulate(book.Instruments, book.Quantities, rows.Data, rows.Stride, vectors, result.Row(b));
            }
        });
        return output;
    }
}
