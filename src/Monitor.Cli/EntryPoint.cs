namespace Monitor.Cli;

/// <summary>Parses the command line and dispatches to a verb.</summary>
internal static class EntryPoint
{
    public static int Run(string[] args)
    {
        Console.Error.WriteLine("monitor: no verbs yet");
        return args.Length == 0 ? 1 : 2;
    }
}
