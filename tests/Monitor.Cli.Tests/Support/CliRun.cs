using System.CommandLine;
using Monitor.Cli.Verbs;

namespace Monitor.Cli.Tests.Support;

/// <summary>Runs the analyst verbs in-process with captured output and error writers (no global Console state, so tests can run in parallel).</summary>
internal static class CliRun
{
    public static (int Exit, string Out, string Err) Invoke(params string[] args)
    {
        var root = new RootCommand("monitor (test)") { FitVerb.Create(), RiskVerb.Create(), ExplainVerb.Create(), BondVerb.Create(), CurveVerb.Create(), VerifyLogVerb.Create() };
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exit = root.Parse(args).Invoke(new InvocationConfiguration { Output = output, Error = error });
        return (exit, output.ToString(), error.ToString());
    }

    /// <summary>Path of a file in the test project's Data folder (copied to the output directory).</summary>
    public static string Data(string name) => Path.Combine(AppContext.BaseDirectory, "Data", name);
}
