using System.Text;
using Monitor.Service.Storage;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Storage;

/// <summary>The one cut-back of a partial write that the exposure log and the trade journal share.</summary>
public sealed class PartialWriteCutBackTests
{
    [Fact]
    public void The_bytes_after_the_last_good_record_are_removed_and_returned()
    {
        using var folder = new TempFolder();
        var path = folder.Combine("day.jsonl");
        File.WriteAllText(path, "{\"seq\":1}\n{\"seq\":2,\"pay");

        var removed = PartialWriteCutBack.CutBackTo(path, "{\"seq\":1}\n".Length);

        Assert.Equal("{\"seq\":2,\"pay", Encoding.UTF8.GetString(removed));
        Assert.Equal("{\"seq\":1}\n", File.ReadAllText(path));
        Assert.Empty(PartialWriteCutBack.CutBackTo(path, "{\"seq\":1}\n".Length));
    }

    [Fact]
    public void A_file_shorter_than_its_good_records_is_an_error_naming_the_path_and_both_lengths()
    {
        using var folder = new TempFolder();
        var path = folder.Combine("day.jsonl");
        File.WriteAllText(path, "{\"seq\":1}\n");

        var ex = Assert.Throws<IOException>(() => PartialWriteCutBack.CutBackTo(path, 100));

        Assert.Contains(path, ex.Message, StringComparison.Ordinal);
        Assert.Contains("10 bytes", ex.Message, StringComparison.Ordinal);
        Assert.Contains("100 bytes", ex.Message, StringComparison.Ordinal);
        Assert.Equal("{\"seq\":1}\n", File.ReadAllText(path));
    }

    [Fact]
    public void A_missing_file_is_fine_when_nothing_was_written_to_it_and_an_error_otherwise()
    {
        using var folder = new TempFolder();
        var path = folder.Combine("never-written.jsonl");

        Assert.Empty(PartialWriteCutBack.CutBackTo(path, 0));
        Assert.Contains(path, Assert.Throws<IOException>(() => PartialWriteCutBack.CutBackTo(path, 5)).Message, StringComparison.Ordinal);
    }
}
