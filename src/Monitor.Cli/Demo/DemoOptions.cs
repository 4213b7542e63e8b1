namespace Monitor.Cli.Demo;

/// <summary>How to run the demo: the working folder (config copy, exposure log, service log), the speed (1 = the day in about a minute), live view or plain lines, and the seed of the invented market.</summary>
internal sealed record DemoOptions(string WorkDir, double Speed, bool Live, int Seed = DemoOptions.DefaultSeed)
{
    public const int DefaultSeed = 20260601;

    /// <summary>A new folder under the system temp folder, named by the UTC start time.</summary>
    public static string DefaultWorkDir(DateTimeOffset now) =>
        Path.Combine(Path.GetTempPath(), "monitor-demo-" + now.ToString("yyyyMMdd-HHmmss", System.Globalization.CultureInfo.InvariantCulture));
}
