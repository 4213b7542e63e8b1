using System.Diagnostics;
using System.Globalization;
using Monitor.Analytics.Risk;

namespace Monitor.Benchmarks;

/// <summary>
/// `--memory holdings|ledgers`: builds 1,000,000 positions in 1,000 books in one form, runs one curve change, and prints
/// the managed heap (GC.GetTotalMemory after a full collection) and the process working set. Run each form in its own
/// process so the working sets do not mix.
/// </summary>
internal static class MemoryReport
{
    public static int Run(string form)
    {
        var before = GC.GetTotalMemory(true);
        var ledgers = form.Equals("ledgers", StringComparison.OrdinalIgnoreCase);
        var world = new RiskWorld(1_000, 1_000_000, withLedgers: ledgers);
        object? keep;
        if (ledgers)
        {
            keep = BookRiskCalculator.ComputeAll(world.Ledgers, world.Grid(0, RiskDepth.Durations), RiskDepth.Durations);
        }
        else
        {
            var rows = InstrumentRiskRows.Build(world.Table, world.InstrumentGrid(0), RiskDepth.Durations);
            keep = HoldingsRiskCalculator.ComputeAll(world.Holdings, rows);
        }
        var positionsBytes = (long)world.Positions.Length * 24;
        var heap = GC.GetTotalMemory(true) - before;
        using var process = Process.GetCurrentProcess();
        process.Refresh();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"memory form={form} positions=1000000 books=1000 managed_heap_MB={heap / 1e6:F1} (of which the input position list {positionsBytes / 1e6:F1}) working_set_MB={process.WorkingSet64 / 1e6:F1} peak_working_set_MB={process.PeakWorkingSet64 / 1e6:F1}"));
        GC.KeepAlive(world);
        GC.KeepAlive(keep);
        return 0;
    }
}
