using System.CommandLine;
using Monitor.Cli.Verbs;

namespace Monitor.Cli;

/// <summary>Parses the command line and dispatches to a verb. Each verb lives in its own file under Verbs/.</summary>
internal static class EntryPoint
{
    public static int Run(string[] args)
    {
        var root = new RootCommand("monitor: intraday market-risk surveillance of bond books (a surveillance aid, not a system of record).");
        foreach (var verb in Verbs())
        {
            root.Subcommands.Add(verb);
        }
        return root.Parse(args).Invoke();
    }

    private static IEnumerable<Command> Verbs()
    {
        yield return VerifyLogVerb.Create();
        yield return RunVerb.Create();
        yield return DemoVerb.Create();
        yield return FitVerb.Create();
        yield return RiskVerb.Create();
        yield return ExplainVerb.Create();
        yield return LoadVerb.Create();
    }
}
