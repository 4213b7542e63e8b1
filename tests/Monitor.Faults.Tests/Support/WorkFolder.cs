namespace Monitor.Faults.Tests.Support;

/// <summary>A fresh folder under the system temp folder, deleted on dispose (after any mount in it is gone).</summary>
public sealed class WorkFolder : IDisposable
{
    public WorkFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "monitor-faults-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string Combine(string name) => System.IO.Path.Combine(Path, name);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
