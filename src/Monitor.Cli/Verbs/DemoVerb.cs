using System.CommandLine;
using System.Globalization;
using Monitor.Cli.Demo;
using Spectre.Console;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor demo [--work-dir DIR] [--speed X] [--no-live]</c>: an invented trading day in about a minute, run through
/// the real service in-process. Exit 0 when the day showed a warning, a breach and a clear and the exposure log
/// verifies; 1 otherwise; 2 for a bad option.
/// </summary>
internal static class DemoVerb
{
    public static Command Create()
    {
        var workDir = new Option<DirectoryInfo?>("--work-dir") { Description = "Folder for the scenario's config copy, the exposure log and the service log; default a new monitor-demo-<time> folder under the system temp folder." };
        var speed = new Option<double>("--speed") { Description = "How fast the simulated day runs: 1 = the day in about a minute, 10 = about 6 seconds.", DefaultValueFactory = _ => 1.0 };
        var noLive = new Option<bool>("--no-live") { Description = "Print plain lines instead of the live table (automatic when output is redirected)." };
        var command = new Command("demo", "Run an invented trading day (rates sell-off, spread widening, a large trade) through the service and show books, exposures and limits live.");
        command.Options.Add(workDir);
        command.Options.Add(speed);
        command.Options.Add(noLive);
        command.SetAction(async (parse, cancellationToken) =>
        {
            var x = parse.GetValue(speed);
            if (!(x is > 0 and <= 1000))
            {
                await Console.Error.WriteLineAsync($"--speed: {x.ToString(CultureInfo.InvariantCulture)} is outside (0, 1000]; use 1 for the one-minute day.").ConfigureAwait(false);
                return 2;
            }
            var live = !parse.GetValue(noLive) && !Console.IsOutputRedirected;
            var dir = parse.GetValue(workDir)?.FullName ?? DemoOptions.DefaultWorkDir(DateTimeOffset.UtcNow);
            var outcome = await DemoRunner.RunAsync(new DemoOptions(dir, x, live), Console.Out, live ? AnsiConsole.Console : null, cancellationToken).ConfigureAwait(false);
            return outcome.Succeeded ? 0 : 1;
        });
        return command;
    }
}
