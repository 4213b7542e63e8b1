using Monitor.Service.Audit;

namespace Monitor.Service.Storage;

/// <summary>
/// A day is closed when its exposure-log day file exists and either its last complete record is a
/// <c>service-stopped</c> record whose MAC holds under the record key (the service stopped after the day's last record),
/// or the next day file opens with the <c>day-closed</c> record of that day (written at the roll, after the day's
/// <c>close-snapshot</c> records; its MAC checked likewise). A day with only a journal file, a torn or foreign last line,
/// or any other last record is open. So is every day from the journal's start-of-day state on (<c>start-of-day.json</c>):
/// a restart replays those journal days.
/// </summary>
public sealed class DayEndRecordClosedDays(string exposureLogFolder, RecordKey key, string? journalFolder = null) : IClosedDays
{
    public bool IsClosed(DateOnly day, out string why)
    {
        if (journalFolder is not null && !BeforeStartOfDay(day, out why))
        {
            return false;
        }
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
        if (parsed.Record.Kind != ExposureLogKinds.ServiceStopped && !ClosedInNextFile(day))
        {
            why = $"the last record of '{path}' is '{parsed.Record.Kind}' (seq {parsed.Record.Seq}), not '{ExposureLogKinds.ServiceStopped}', and no '{ExposureLogKinds.DayClosed}' record of the day opens the next day file";
            return false;
        }
        why = string.Empty;
        return true;
    }

    private bool BeforeStartOfDay(DateOnly day, out string why)
    {
        DateOnly? start;
        try
        {
            start = Journal.StartOfDayState.StoredDate(journalFolder!);
        }
        catch (InvalidOperationException ex)
        {
            why = ex.Message;
            return false;
        }
        why = start is { } s && day >= s ? $"a restart replays its journal day (start-of-day state of {s:yyyy-MM-dd})" : string.Empty;
        return why.Length == 0;
    }

    /// <summary>The first day file after <paramref name="day"/> opens (after any repair and close snapshots) with the day's <c>day-closed</c> record.</summary>
    private bool ClosedInNextFile(DateOnly day)
    {
        var next = ExposureLogFiles.List(exposureLogFolder).FirstOrDefault(f => f.Day > day);
        if (next.Path is null)
        {
            return false;
        }
        var date = day.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture);
        foreach (var line in File.ReadLines(next.Path))
        {
            var parsed = ExposureLogLine.Parse(key, System.Text.Encoding.UTF8.GetBytes(line));
            if (parsed.Record is not { } record || !parsed.MacMatches)
            {
                return false;
            }
            if (record.Kind is ExposureLogKinds.LogRepaired or ExposureLogKinds.CloseSnapshot)
            {
                continue;
            }
            return record.Kind == ExposureLogKinds.DayClosed
                && record.Payload.TryGetProperty("businessDate", out var closed) && closed.GetString() == date;
        }
        return false;
    }
}
