using Monitor.Service.Audit;

namespace Monitor.Service.Storage;

/// <summary>
/// A day is closed when its exposure-log day file exists and its last complete record is a <c>day-end</c> record that
/// parses with a MAC that holds under the record key (the service writes it when it stops). A day with only a journal file, a torn or
/// foreign last line, or any other last record is open.
/// </summary>
public sealed class DayEndRecordClosedDays(string exposureLogFolder, RecordKey key) : IClosedDays
{
    public bool IsClosed(DateOnly day, out string why)
    {
        var path = ExposureLogFiles.PathOf(exposureLogFolder, day);
        if (!File.Exists(path))
        {
            why = $"it has no exposure-log file '{path}'";
            return false;
        }
        var tail = ExposureLogTail.Read(path);
        if (tail.LastLine is null || tail.Fragment.Length > 0)
        {
            why = $"'{path}' does not end with a complete record";
            return false;
        }
        var parsed = ExposureLogLine.Parse(key, tail.LastLine);
        if (parsed.Record is null || !parsed.MacMatches)
        {
            why = $"the last line of '{path}' is not a valid record";
            return false;
        }
        if (parsed.Record!.Kind != ExposureLogKinds.DayEnd)
        {
            why = $"the last record of '{path}' is '{parsed.Record.Kind}' (seq {parsed.Record.Seq}), not '{ExposureLogKinds.DayEnd}'";
            return false;
        }
        why = string.Empty;
        return true;
    }
}
