namespace Monitor.Cli.Tests.Support;

/// <summary>A throw-away folder for edited copies of the data files; deleted on dispose.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "monitor-cli-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    /// <summary>Writes <paramref name="lines"/> to a file in the folder and returns its path.</summary>
    public string Write(string name, IEnumerable<string> lines)
    {
        var file = System.IO.Path.Combine(Path, name);
        File.WriteAllLines(file, lines);
        return file;
    }

    /// <summary>A copy of a data file with <paramref name="edit"/> applied to each line.</summary>
    public string Edited(string dataFile, Func<string, string> edit) =>
        Write(dataFile, File.ReadAllLines(CliRun.Data(dataFile)).Select(edit));

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
            // best effort: the OS cleans the temp folder
        }
    }
}
