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
        // A stopping service drains its outbox and lets held consumers return their messages to the broker; the
        // parser's default of 2 s after SIGTERM/Ctrl+C would cut that short. The host's own stop is bounded below this.
        return root.Parse(args).Invoke(new InvocationConfiguration { ProcessTerminationTimeout = ShutdownAllowance });
    }

    /// <summary>How long a verb has to stop after SIGTERM or Ctrl+C before the process ends anyway.</summary>
    public static readonly TimeSpan ShutdownAllowance = TimeSpan.FromSeconds(45);

    /// <summary>Every verb, in help order (tests check their options).</summary>
    internal static IEnumerable<Command> Verbs()
    {
        yield return VerifyLogVerb.Create();
        yield return RunVerb.Create();
        yield return DemoVerb.Create();
        yield return FitVerb.Create();
        yield return RiskVerb.Create();
        yield return ExplainVerb.Create();
        yield return BondVerb.Create();
        yield return CurveVerb.Create();
        yield return LoadVerb.Create();
    }
}
