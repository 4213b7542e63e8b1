using Monitor.Cli.Demo;
using Spectre.Console;

namespace Monitor.Cli.Tests.Demo;

/// <summary>The live table marks provisional figures beside the figure and explains the mark (our own convention).</summary>
public sealed class LiveViewTests
{
    private static readonly DateTimeOffset Noon = new(2026, 6, 1, 12, 0, 0, TimeSpan.Zero);

    [Fact]
    public void A_provisional_book_is_marked_beside_its_figures_with_a_legend()
    {
        var final = new BookRow("RATES-A", "rates", 10_000_000, 5_000, 5_000, 1_000, 500, 0, 0.5, "within");
        var provisional = new BookRow("CREDIT-A", "credit", 30_000_000, 9_000, 9_000, 2_000, 700, 4_000, 0.2, "within", Provisional: true);

        var marked = Render(new DemoSnapshot(Noon, [final, provisional], [], []));
        var plain = Render(new DemoSnapshot(Noon, [final], [], []));

        var creditLine = marked.Split('\n').Single(l => l.Contains("CREDIT-A", StringComparison.Ordinal));
        Assert.Contains(BookRow.ProvisionalMark, creditLine, StringComparison.Ordinal);
        Assert.DoesNotContain(BookRow.ProvisionalMark, marked.Split('\n').Single(l => l.Contains("RATES-A", StringComparison.Ordinal)), StringComparison.Ordinal);
        Assert.Contains("provisional", marked, StringComparison.Ordinal);
        Assert.DoesNotContain("provisional", plain, StringComparison.Ordinal);
    }

    private static string Render(DemoSnapshot snapshot)
    {
        var output = new StringWriter();
        var console = AnsiConsole.Create(new AnsiConsoleSettings { Ansi = AnsiSupport.No, ColorSystem = ColorSystemSupport.NoColors, Out = new AnsiConsoleOutput(output) });
        console.Profile.Width = 200;
        console.Write(LiveView.Render(snapshot, new DemoRecorder()));
        return output.ToString();
    }
}
