using Monitor.Files.Csv;

namespace Monitor.Files;

/// <summary>Opens a file for one of the readers and turns a missing or unreadable file into a clear error.</summary>
internal static class FileReading
{
    public static T Read<T>(string path, Func<TextReader, string, T> read)
    {
        try
        {
            using var reader = new StreamReader(path);
            return read(reader, path);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new CsvFileException(path, 0, null, null, $"cannot be read: {ex.Message}");
        }
    }
}
