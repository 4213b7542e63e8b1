using Monitor.Analytics.Instruments;
using Monitor.Analytics.Risk;
using Monitor.Files;
using Monitor.Files.Csv;

namespace Monitor.Cli.Verbs;

/// <summary>
/// The positions file read against the instruments: every position's bond must be in the instruments file (else a
/// <see cref="CsvFileException"/> naming the positions file, line, column and value), books in first-seen order.
/// </summary>
internal sealed class BookPositions
{
    private BookPositions(IReadOnlyList<(PositionRecord Record, Bond Bond)> positions)
    {
        Positions = positions;
        Books = [.. positions.Select(p => p.Record.Book).Distinct(StringComparer.Ordinal)];
    }

    public IReadOnlyList<(PositionRecord Record, Bond Bond)> Positions { get; }

    public IReadOnlyList<string> Books { get; }

    /// <summary>Spread groups of the bonds held.</summary>
    public IEnumerable<string> SpreadGroups =>
        Positions.Select(p => p.Bond.SpreadGroup).OfType<string>().Where(g => !CurveKey.IsGovernment(g)).Distinct(StringComparer.Ordinal);

    public static BookPositions Load(string path, IReadOnlyDictionary<string, Bond> instruments)
    {
        var records = PositionFile.Read(path);
        var positions = new List<(PositionRecord, Bond)>(records.Count);
        for (var i = 0; i < records.Count; i++)
        {
            var r = records[i];
            if (!instruments.TryGetValue(r.InstrumentId, out var bond))
            {
                throw new CsvFileException(path, LineOf(path, i), "instrument_id", r.InstrumentId, "is not in the instruments file.");
            }
            positions.Add((r, bond));
        }
        return new BookPositions(positions);
    }

    /// <summary>
    /// One cash-flow ledger per book (all sharing one date index): each position's flows after
    /// <paramref name="after"/>, scaled by face / 100, under its bond's curve key.
    /// </summary>
    public Dictionary<string, BookCashFlowLedger> Ledgers(DateOnly after)
    {
        var dates = new CashFlowDateIndex();
        var ledgers = Books.ToDictionary(b => b, _ => new BookCashFlowLedger(dates), StringComparer.Ordinal);
        foreach (var (record, bond) in Positions)
        {
            ledgers[record.Book].Add(bond.SpreadGroup, bond.CashFlowsAfter(after), record.FaceAmount / 100.0);
        }
        return ledgers;
    }

    // The file line of the i-th record: PositionFile yields one record per data row, in file order.
    private static int LineOf(string path, int index)
    {
        using var reader = new StreamReader(path);
        return CsvTable.Read(reader, path, ["book", "instrument_id", "face_amount"], []).ElementAt(index).Line;
    }
}
