using System.Diagnostics;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// A small tmpfs mounted on a folder (`mount -t tmpfs -o size=N tmpfs DIR`; needs root, which CI is), so that a test
/// can fill the disk for real: <see cref="Fill"/> writes a filler file until the kernel answers ENOSPC, <see cref="Free"/>
/// deletes it. Dispose unmounts (lazily, if a process still holds a file open).
/// </summary>
public sealed class TmpfsMount : IDisposable
{
    private const string FillerName = "zz-filler.bin";

    private TmpfsMount(string folder, long sizeBytes)
    {
        Folder = folder;
        SizeBytes = sizeBytes;
    }

    public string Folder { get; }

    public long SizeBytes { get; }

    private string FillerPath => Path.Combine(Folder, FillerName);

    public static TmpfsMount Create(string folder, long sizeBytes)
    {
        Directory.CreateDirectory(folder);
        Run("mount", "-t", "tmpfs", "-o", $"size={sizeBytes}", "tmpfs", folder);
        return new TmpfsMount(folder, sizeBytes);
    }

    /// <summary>Writes the filler until the file system is full; returns the bytes it took. Appends to it when called again.</summary>
    public long Fill()
    {
        var block = new byte[4096];
        long written = 0;
        using var filler = new FileStream(FillerPath, FileMode.Append, FileAccess.Write, FileShare.None, bufferSize: 1);
        try
        {
            while (true)
            {
                filler.Write(block);
                written += block.Length;
            }
        }
        catch (IOException ex) when (IsDiskFull(ex))
        {
        }
        // Top up byte by byte: the last page may take less than a whole block.
        try
        {
            while (true)
            {
                filler.WriteByte(0);
                written++;
            }
        }
        catch (IOException ex) when (IsDiskFull(ex))
        {
        }
        return written;
    }

    /// <summary>Deletes the filler: the space is back.</summary>
    public void Free() => File.Delete(FillerPath);

    public void Dispose()
    {
        try
        {
            Run("umount", Folder);
        }
        catch (InvalidOperationException)
        {
            Run("umount", "-l", Folder);
        }
    }

    private static bool IsDiskFull(IOException ex) => ex.Message.Contains("No space left on device", StringComparison.OrdinalIgnoreCase);

    private static void Run(string command, params string[] arguments)
    {
        var info = new ProcessStartInfo(command) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var argument in arguments)
        {
            info.ArgumentList.Add(argument);
        }
        using var process = Process.Start(info)!;
        var stderr = process.StandardError.ReadToEnd();
        process.StandardOutput.ReadToEnd();
        if (!process.WaitForExit(30_000) || process.ExitCode != 0)
        {
            throw new InvalidOperationException($"{command} {string.Join(' ', arguments)} failed: {stderr.Trim()} (tests that mount a tmpfs need root)");
        }
    }
}
