using Spectre.Console;
using Spectre.Console.Rendering;

namespace Monitor.Cli.Output;

/// <summary>
/// A Spectre.Console console over a verb's output writer (so tests can capture it), no colours, and wide enough
/// for the risk tables when the output is not a terminal. Cells are plain <see cref="Text"/> (no markup parsing).
/// </summary>
internal static class TableConsole
{
    private const int RedirectedWidth = 200;

    public static IAnsiConsole Create(TextWriter writer)
    {
        var output = new AnsiConsoleOutput(writer);
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = output,
            Ansi = AnsiSupport.No,
            ColorSystem = ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.No,
        });
        if (!output.IsTerminal || ReferenceEquals(writer, Console.Out) && Console.IsOutputRedirected)
        {
            console.Profile.Width = RedirectedWidth;
        }
        return console;
    }

    /// <summary>A table with a title and columns; a column whose name starts with '&gt;' is right-aligned (numbers).</summary>
    public static Table Table(string title, params string[] columns)
    {
        var table = new Table { Title = new TableTitle(Markup.Escape(title)), Border = TableBorder.Rounded };
        foreach (var c in columns)
        {
            var right = c.StartsWith('>');
            var column = new TableColumn(new Text(right ? c[1..] : c));
            table.AddColumn(right ? column.RightAligned() : column);
        }
        return table;
    }

    public static void Row(Table table, params string[] cells) =>
        table.AddRow(cells.Select(c => (IRenderable)new Text(c)).ToArray());

    public static void Line(IAnsiConsole console, string text) => console.Write(new Text(text + Environment.NewLine));
}
