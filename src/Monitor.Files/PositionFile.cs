using Monitor.Files.Csv;

namespace Monitor.Files;

/// <summary>
/// Positions file (our format): <c>book,instrument_id,face_amount</c>; face amount signed
/// (positive long, negative short), in currency units of face.
/// </summary>
public static class PositionFile
{
    private static readonly string[] Required = ["book", "instrument_id", "face_amount"];

    public static IReadOnlyList<PositionRecord> Read(TextReader reader, string fileName)
    {
        var positions = new List<PositionRecord>();
        foreach (var row in CsvTable.Read(reader, fileName, Required, []))
        {
            var face = row.RequiredNumber("face_amount");
            positions.Add(new PositionRecord(row.RequiredText("book"), row.RequiredText("instrument_id"), face));
        }
        return positions;
    }

    public static IReadOnlyList<PositionRecord> Read(string path) => FileReading.Read(path, Read);
}
