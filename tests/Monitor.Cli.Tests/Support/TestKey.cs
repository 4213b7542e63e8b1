using Monitor.Service.Storage;

namespace Monitor.Cli.Tests.Support;

/// <summary>The record key the tests write and verify with (a fixed invented secret; never a real one).</summary>
internal static class TestKey
{
    public const string Text = "test-record-key-0123456789abcdef0123456789abcdef";

    public static readonly RecordKey Value = RecordKey.FromText(Text, "the tests' key");

    /// <summary>Writes the key to <c>record.key</c> in <paramref name="folder"/> (keep it outside the log and journal folders) and returns the path.</summary>
    public static string FileIn(string folder)
    {
        Directory.CreateDirectory(folder);
        var path = Path.Combine(folder, "record.key");
        File.WriteAllText(path, Text);
        return path;
    }
}
