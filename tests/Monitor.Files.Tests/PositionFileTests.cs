using Monitor.Files;
using Monitor.Files.Csv;

namespace Monitor.Files.Tests;

public class PositionFileTests
{
    [Fact]
    public void Reads_signed_face_amounts()
    {
        var rows = PositionFile.Read(new StringReader("book,instrument_id,face_amount\nRATES-1,GV-2030,5000000\nRATES-1,GV-2035,-2500000\n"), "p.csv");
        Assert.Equal(-2_500_000, rows[1].FaceAmount);
        Assert.Equal("RATES-1", rows[0].Book);
    }

    [Fact]
    public void Blank_book_is_named()
    {
        var ex = Assert.Throws<CsvFileException>(() => PositionFile.Read(new StringReader("book,instrument_id,face_amount\n,GV-2030,5\n"), "p.csv"));
        Assert.Equal("book", ex.Column);
        Assert.Equal(2, ex.Line);
    }
}
