using System.Diagnostics;
using System.Globalization;

namespace Monitor.Benchmarks;

/// <summary>
/// `--latency`: the tail a benchmark mean hides. On <see cref="SmallBooksWorld"/> (the load's shape), 500 government refits
/// to warm up, then 3,000 timed one by one: p50 / p90 / p99 of the whole refit and of its revaluation
/// (<c>EngineResult.ExposureMilliseconds</c>), the collections and GC pause time over the 3,000, bytes allocated per refit
/// and the process's CPU time per refit (every thread: pool threads of a parallel pass and the GC count too).
/// </summary>
internal static class SmallBooksLatencyReport
{
    private const int WarmUp = 500;
    private const int Refits = 3_000;

    public static int Run()
    {
        var world = new SmallBooksWorld(1_000);
        for (var i = 0; i < WarmUp; i++)
        {
            world.RefitGovernment(i);
        }
        var whole = new double[Refits];
        var revalue = new double[Refits];
        var pause = GC.GetTotalPauseDuration();
        var (gen0, gen1, gen2) = (GC.CollectionCount(0), GC.CollectionCount(1), GC.CollectionCount(2));
        var allocated = GC.GetAllocatedBytesForCurrentThread();
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        for (var i = 0; i < Refits; i++)
        {
            var clock = Stopwatch.StartNew();
            var result = world.RefitGovernment(WarmUp + i);
            whole[i] = clock.Elapsed.TotalMilliseconds;
            revalue[i] = result.ExposureMilliseconds;
        }
        allocated = GC.GetAllocatedBytesForCurrentThread() - allocated;
        cpu = Process.GetCurrentProcess().TotalProcessorTime - cpu;
        Array.Sort(whole);
        Array.Sort(revalue);
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"// LATENCY small books, {Refits} government refits, ms: whole refit p50 {At(whole, 0.5):F3} p90 {At(whole, 0.9):F3} p99 {At(whole, 0.99):F3} max {whole[^1]:F3}; revaluation p50 {At(revalue, 0.5):F3} p90 {At(revalue, 0.9):F3} p99 {At(revalue, 0.99):F3} max {revalue[^1]:F3}"));
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"// GC over them: pause {(GC.GetTotalPauseDuration() - pause).TotalMilliseconds:F1} ms, collections gen0 {GC.CollectionCount(0) - gen0} gen1 {GC.CollectionCount(1) - gen1} gen2 {GC.CollectionCount(2) - gen2}; allocated {allocated / Refits / 1024.0:F1} KB a refit (this thread); process CPU {cpu.TotalMilliseconds / Refits:F3} ms a refit (all threads, GC included)"));
        return 0;
    }

    private static double At(double[] sorted, double quantile) => sorted[(int)(quantile * (sorted.Length - 1))];
}
