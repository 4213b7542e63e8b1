using System.Globalization;
using System.Text;
using Monitor.Service.Storage;

namespace Monitor.Service.Audit;

/// <summary>
/// The checkpoint files: <c>checkpoints-yyyy-MM-dd.jsonl</c> (day of the record anchored) in the checkpoint folder,
/// one checkpoint line per cut, appended and fsynced.
/// </summary>
public static class ExposureLogCheckpointFiles
{
    private const string Prefix = "checkpoints-";
    private const string Suffix = ".jsonl";

    public static string PathOf(string folder, DateOnly day) =>
        Path.Combine(folder, Prefix + day.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + Suffix);

    /// <summary>Appends the checkpoint's line to its day's file and puts it on the disk.</summary>
    public static void Append(string folder, RecordKey key, ExposureLogCheckpoint checkpoint)
    {
        ArgumentNullException.ThrowIfNull(checkpoint);
        Directory.CreateDirectory(folder);
        var path = PathOf(folder, checkpoint.Day);
        var cutBackTo = File.Exists(path) ? FileLength.Of(path) : 0;
        var bytes = Encoding.UTF8.GetBytes(checkpoint.ToLine(key) + "\n");
        try
        {
            using var stream = new FileStream(path, FileMode.Append, FileAccess.Write, FileShare.Read);
            stream.Write(bytes);
            stream.Flush(flushToDisk: true);
        }
        catch (IOException) when (File.Exists(path))
        {
            PartialWriteCutBack.CutBackTo(path, cutBackTo); // no torn checkpoint line stays behind a failed write
            throw;
        }
    }

    /// <summary>Every checkpoint line in the folder, by file (oldest day first) and line; each parsed or with its problem.</summary>
    public static IReadOnlyList<(string File, int Line, ExposureLogCheckpoint? Checkpoint, string? Problem)> ReadAll(string folder, RecordKey key)
    {
        var result = new List<(string, int, ExposureLogCheckpoint?, string?)>();
        if (!Directory.Exists(folder))
        {
            return result;
        }
        foreach (var path in Directory.EnumerateFiles(folder, Prefix + "*" + Suffix).Order(StringComparer.Ordinal))
        {
            var name = Path.GetFileName(path);
            var number = 0;
            foreach (var line in File.ReadLines(path))
            {
                number++;
                if (line.Length == 0)
                {
                    continue;
                }
                var checkpoint = ExposureLogCheckpoint.Parse(key, line, out var problem);
                result.Add((name, number, checkpoint, problem));
            }
        }
        return result;
    }
}
