using Spectre.Console;
using Spectre.Console.Rendering;

namespace Monitor.Cli.Demo;

/// <summary>
/// The demo's live console view (Spectre.Console Live display), redrawn four times a second: the clock, counts,
/// books with their exposures and limit use, every limit, the curves, and the latest status changes.
/// </summary>
internal sealed class LiveView(IAnsiConsole console)
{
    private const int EventsShown = 8;

    public async Task RunAsync(Func<Task<DemoSnapshot>> capture, DemoRecorder recorder, Task until)
    {
        ArgumentNullException.ThrowIfNull(capture);
        ArgumentNullException.ThrowIfNull(recorder);
        ArgumentNullException.ThrowIfNull(until);
        var first = await capture().ConfigureAwait(false);
        await console.Live(Render(first, recorder)).AutoClear(false).Overflow(VerticalOverflow.Ellipsis).StartAsync(async context =>
        {
            while (!until.IsCompleted)
            {
                await Task.WhenAny(until, Task.Delay(250)).ConfigureAwait(false);
                context.UpdateTarget(Render(await capture().ConfigureAwait(false), recorder));
            }
        }).ConfigureAwait(false);
    }

    private static IRenderable Render(DemoSnapshot snapshot, DemoRecorder recorder)
    {
        var elapsed = snapshot.SimulatedTime - DemoScenario.DayStart;
        var header = new Markup(
            $"[bold]Aldermoor Capital[/] (invented)  simulated day {DemoScenario.TradeDate:yyyy-MM-dd}  [bold]{DemoFormat.Clock(snapshot.SimulatedTime)} UTC[/]  " +
            $"(elapsed {DemoFormat.Duration(elapsed)})   quotes {recorder.QuotesSent}  fits {recorder.Fits}  refused {recorder.Rejections().Count}  trades {recorder.TradesSent}");

        var books = new Table().Border(TableBorder.Rounded).Title("Books (XTS; per-bp figures in XTS per bp)");
        foreach (var column in new[] { "Book", "Value", "DV01", "Level", "Slope", "Curvature", "Spread level", "Limit use" })
        {
            books.AddColumn(new TableColumn(column).RightAligned());
        }
        foreach (var b in snapshot.Books)
        {
            books.AddRow(
                new Text(b.Book), new Text(DemoFormat.Millions(b.Value)), new Text(DemoFormat.Money(b.Dv01)), new Text(DemoFormat.Money(b.BaseLevel)),
                new Text(DemoFormat.Money(b.BaseSlope)), new Text(DemoFormat.Money(b.BaseCurvature)), new Text(DemoFormat.Money(b.SpreadLevel)),
                new Markup(UseMarkup(b.MaxUse, b.Status)));
        }

        var limits = new Table().Border(TableBorder.Simple).Title("Limits");
        foreach (var column in new[] { "Limit", "Scope", "Measure", "Exposure", "Bound", "Use", "Status" })
        {
            limits.AddColumn(column);
        }
        foreach (var l in snapshot.Limits)
        {
            limits.AddRow(
                new Text(l.Id), new Text(l.Scope), new Text(l.Measure), new Text(DemoFormat.Money(l.Exposure)),
                new Text(l.Bound is { } bound ? DemoFormat.Money(bound) : "-"), new Markup(UseMarkup(l.Use, l.Status)), new Text(l.Status));
        }

        var curves = new Markup("Curves: " + string.Join("   ", snapshot.Curves.Select(c =>
            $"[bold]{Markup.Escape(c.Curve)}[/] v{c.Version} RMSE {(c.RmseBp is { } r ? DemoFormat.Number(r, "F2") + " bp" : "-")}{(c.LastRejected ? " [red](last refit refused)[/]" : string.Empty)}")));

        var changes = recorder.Changes();
        var events = changes.Skip(Math.Max(0, changes.Count - EventsShown))
            .Select(c => new Markup(ChangeColour(c.Kind) is var colour ? $"[{colour}]{Markup.Escape(DemoFormat.StatusLine(c))}[/]" : string.Empty))
            .Cast<IRenderable>().ToList();
        if (events.Count == 0)
        {
            events.Add(new Text("(no limit status changes yet)"));
        }
        var panel = new Panel(new Rows(events)).Header("Limit status changes (latest last)").Expand();
        return new Rows(header, books, limits, curves, panel);
    }

    private static string UseMarkup(double use, string status)
    {
        var colour = status == "breach" || use >= 1.0 ? "red" : status == "warning" || use >= 0.8 ? "yellow" : "green";
        return $"[{colour}]{DemoFormat.Percent(use)}[/]";
    }

    private static string ChangeColour(StatusChangeKind kind) => kind switch
    {
        StatusChangeKind.Breach => "red",
        StatusChangeKind.Warning => "yellow",
        _ => "green",
    };
}
