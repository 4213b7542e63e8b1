using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Diagnosers;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Running;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using Monitor.Benchmarks;

// Usage (see README.md):
//   dotnet run -c Release --project tests/Monitor.Benchmarks -- --short --filter '*'
//   dotnet run -c Release --project tests/Monitor.Benchmarks -- --filter '*Revalue*'
//   dotnet run -c Release --project tests/Monitor.Benchmarks -- --memory holdings|ledgers
//   dotnet run -c Release --project tests/Monitor.Benchmarks -- --latency
if (args.Length >= 1 && args[0] == "--latency")
{
    return SmallBooksLatencyReport.Run();
}
if (args.Length >= 1 && args[0] == "--memory")
{
    return MemoryReport.Run(args.Length > 1 ? args[1] : "holdings");
}

var isShort = args.Contains("--short");
var rest = args.Where(a => a != "--short").ToArray();
IConfig config = DefaultConfig.Instance.AddDiagnoser(MemoryDiagnoser.Default);
if (isShort)
{
    // In-process (no per-benchmark project build), 1 warm-up and 3 measured iterations of ~200 ms: minutes, not hours.
    config = config.AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance)
        .WithWarmupCount(1).WithIterationCount(3).WithLaunchCount(1)
        .WithIterationTime(Perfolizer.Horology.TimeInterval.FromMilliseconds(200)).WithId("Short"));
}
BenchmarkSwitcher.FromAssembly(typeof(RevalueBenchmarks).Assembly).Run(rest, config);
return 0;
