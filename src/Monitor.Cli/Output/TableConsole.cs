using System.Runtime.CompilerServices;
using Spectre.Console;
using Spectre.Console.Rendering;

namespace Monitor.Cli.Output;

/// <summary>
/// A Spectre.Console console over a verb's output writer (so tests can capture it), no colours, and wide enough
/// for the risk tables when the output is not a terminal. Cells are plain <see cref="Text"/> (no markup parsing).
/// A number is never broken across lines: right-aligned (numeric) columns do not wrap, text columns wrap only between
/// words, and a table that cannot fit the console that way is printed as plain lines, one cell a line.
/// </summary>
internal static class TableConsole
{
    private const int RedirectedWidth = 200;

    // Rounded border: "│ " before each cell, " " after it, and the closing "│".
    private const int BorderPerColumn = 3;

    private static readonly ConditionalWeakTable<Table, TableText> Texts = [];

    public static IAnsiConsole Create(TextWriter writer) => Create(writer, null);

    /// <summary>A console of <paramref name="width"/> columns (tests), or the terminal's width (200 when redirected).</summary>
    public static IAnsiConsole Create(TextWriter writer, int? width)
    {
        var output = new AnsiConsoleOutput(writer);
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = output,
            Ansi = AnsiSupport.No,
            ColorSystem = ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.No,
        });
        if (width is { } w)
        {
            console.Profile.Width = w;
        }
        else if (!output.IsTerminal || ReferenceEquals(writer, Console.Out) && Console.IsOutputRedirected)
        {
            console.Profile.Width = RedirectedWidth;
        }
        return console;
    }

    /// <summary>A table with a title and columns; a column whose name starts with '&gt;' is right-aligned and does not wrap (numbers).</summary>
    public static Table Table(string title, params string[] columns)
    {
        var table = new Table { Title = new TableTitle(Markup.Escape(title)), Border = TableBorder.Rounded };
        var numeric = new bool[columns.Length];
        for (var i = 0; i < columns.Length; i++)
        {
            var c = columns[i];
            numeric[i] = c.StartsWith('>');
            var column = new TableColumn(new Text(numeric[i] ? c[1..] : c));
            table.AddColumn(numeric[i] ? column.RightAligned().NoWrap() : column);
        }
        Texts.Add(table, new TableText(title, [.. columns.Select(c => c.TrimStart('>'))], numeric));
        return table;
    }

    public static void Row(Table table, params string[] cells)
    {
        table.AddRow(cells.Select(c => (IRenderable)new Text(c)).ToArray());
        if (Texts.TryGetValue(table, out var text))
        {
            text.Rows.Add(cells);
        }
    }

    /// <summary>Writes the table, or plain lines when its narrowest layout that keeps every number whole is wider than the console.</summary>
    public static void Write(IAnsiConsole console, Table table)
    {
        if (!Texts.TryGetValue(table, out var text) || text.MinimumWidth() <= console.Profile.Width)
        {
            console.Write(table);
            return;
        }
        Line(console, text.Title);
        foreach (var row in text.Rows)
        {
            Line(console, "- " + (row.Length > 0 ? row[0] : string.Empty));
            for (var i = 1; i < row.Length && i < text.Columns.Length; i++)
            {
                if (row[i].Length > 0)
                {
                    Line(console, $"    {text.Columns[i]}: {row[i]}");
                }
            }
        }
    }

    public static void Line(IAnsiConsole console, string text) => console.Write(new Text(text + Environment.NewLine));

    /// <summary>The cells as text, to measure the table and to print it as lines.</summary>
    private sealed record TableText(string Title, string[] Columns, bool[] Numeric)
    {
        public List<string[]> Rows { get; } = [];

        /// <summary>Sum over columns of the widest cell (numeric) or the longest word (text), plus the borders.</summary>
        public int MinimumWidth()
        {
            var width = 1;
            for (var i = 0; i < Columns.Length; i++)
            {
                var cells = Rows.Select(r => i < r.Length ? r[i] : string.Empty).Append(Columns[i]);
                var content = Numeric[i]
                    ? cells.Max(c => c.Length)
                    : cells.SelectMany(c => c.Split(' ')).Max(w => w.Length);
                width += content + BorderPerColumn;
            }
            return width;
        }
    }
}
