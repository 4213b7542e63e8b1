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

    internal static IRenderable Render(DemoSnapshot snapshot, DemoRecorder recorder)
    {
        var now = snapshot.SimulatedTime < DemoScenario.DayEnd ? snapshot.SimulatedTime : DemoScenario.DayEnd;
        var header = new Rows(
            new Markup($"[bold]Pellowmere Capital[/] (invented), simulated {DemoScenario.TradeDate:yyyy-MM-dd} [bold]{DemoFormat.Clock(now)} UTC[/], {DemoFormat.Duration(now - DemoScenario.DayStart)} into the day"),
            new Markup($"quotes {recorder.QuotesSent}  curves fitted {recorder.Fits}  refits refused {recorder.Rejections().Count}  trades {recorder.TradesSent}"));

        var books = new Table().Border(TableBorder.Rounded).Title("Books (XTS; per-bp figures in XTS per bp)");
        books.AddColumn(new TableColumn("Book").NoWrap());
        foreach (var column in new[] { "Value", "DV01", "Level", "Slope", "Curv.", "Spread", "Use" })
        {
            books.AddColumn(new TableColumn(column).RightAligned().NoWrap());
        }
        foreach (var b in snapshot.Books)
        {
            books.AddRow(
                new Text(b.Book), new Text(DemoFormat.Millions(b.Value) + b.Mark), new Text(DemoFormat.Money(b.Dv01)), new Text(DemoFormat.Money(b.BaseLevel)),
                new Text(DemoFormat.Money(b.BaseSlope)), new Text(DemoFormat.Money(b.BaseCurvature)), new Text(DemoFormat.Money(b.SpreadLevel)),
                new Markup(UseMarkup(b.MaxUse, b.Status)));
        }
        if (snapshot.Books.Any(b => b.Provisional))
        {
            books.Caption(BookRow.ProvisionalLegend);
        }

        var limits = new Table().Border(TableBorder.Simple).Title("Limits");
        limits.AddColumn(new TableColumn("Limit").NoWrap());
        limits.AddColumn(new TableColumn("Scope").NoWrap());
        limits.AddColumn(new TableColumn("Measure"));
        foreach (var column in new[] { "Exposure", "Bound", "Use" })
        {
            limits.AddColumn(new TableColumn(column).RightAligned().NoWrap());
        }
        foreach (var l in snapshot.Limits)
        {
            var money = l.Measure == "marketValue" ? (Func<double, string>)DemoFormat.Millions : DemoFormat.Money;
            limits.AddRow(
                new Text(l.Id), new Text(l.Scope), new Text(l.Measure), new Text(money(l.Exposure)),
                new Text(l.Bound is { } bound ? money(bound) : "-"), new Markup(UseMarkup(l.Use, l.Status) + " " + l.Status));
        }

        var curves = new Markup("Curves: " + string.Join("   ", snapshot.Curves.Select(c =>
            $"[bold]{Markup.Escape(c.Curve)}[/] v{c.Version} RMSE {(c.RmseBp is { } r ? DemoFormat.Number(r, "F2") + " bp" : "-")}{(c.LastRejected ? " [red](last refit refused)[/]" : string.Empty)}")));

        var leftOut = recorder.LeftOut();
        var outliers = new Markup("Left out of fits: " + (leftOut.Count == 0
            ? "none yet"
            : string.Join("   ", leftOut.Skip(Math.Max(0, leftOut.Count - 2)).Select(q => $"[yellow]{Markup.Escape(q)}[/]"))));

        var changes = recorder.Changes();
        var events = changes.Skip(Math.Max(0, changes.Count - EventsShown))
            .Select(c => new Markup(ChangeColour(c.Kind) is var colour ? $"[{colour}]{Markup.Escape(DemoFormat.StatusLine(c))}[/]" : string.Empty))
            .Cast<IRenderable>().ToList();
        if (events.Count == 0)
        {
            events.Add(new Text("(no limit status changes yet)"));
        }
        var panel = new Panel(new Rows(events)).Header("Limit status changes (latest last)").Expand();
        return new Rows(header, books, limits, curves, outliers, panel);
    }

    // Coloured by the service's status, which each limit judges with its own warning level and hysteresis band
    // (a fixed 80% here would disagree with a limit that warns at 70% or 90%).
    private static string UseMarkup(double use, string status)
    {
        var colour = status switch { "breach" => "red", "warning" => "yellow", _ => "green" };
        return $"[{colour}]{DemoFormat.Percent(use)}[/]";
    }

    private static string ChangeColour(StatusChangeKind kind) => kind switch
    {
        StatusChangeKind.Breach => "red",
        StatusChangeKind.Warning => "yellow",
        _ => "green",
    };
}
