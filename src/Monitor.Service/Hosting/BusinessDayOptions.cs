using System.Globalization;
using Monitor.Service.Engine;

namespace Monitor.Service.Hosting;

/// <summary>
/// Configuration section <c>Monitor:BusinessDay</c>: when the business day rolls. The journal and the exposure log
/// name their day files by business date, a restart replays every journal day since the start-of-day state, and the
/// roll passing while the service runs closes the day (<c>close-snapshot</c> records and a <c>day-closed</c> record).
/// </summary>
public sealed class BusinessDayOptions
{
    public const string SectionName = "Monitor:BusinessDay";

    /// <summary>Local time of day at which the business day rolls, <c>HH:mm</c>. Default <c>00:00</c>.</summary>
    public string RollTime { get; set; } = "00:00";

    /// <summary>IANA time zone of <see cref="RollTime"/>, e.g. <c>America/New_York</c>. Default <c>Etc/UTC</c>.</summary>
    public string TimeZone { get; set; } = "Etc/UTC";

    /// <summary>Problems with these settings, each naming the key, the value and the fix; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (!TryParseTime(RollTime, out _))
        {
            errors.Add($"{SectionName}:{nameof(RollTime)}: '{RollTime}' is not a time of day; use HH:mm, e.g. 17:00.");
        }
        if (!TryFindZone(TimeZone, out _))
        {
            errors.Add($"{SectionName}:{nameof(TimeZone)}: '{TimeZone}' is not an IANA time zone on this machine; use e.g. Europe/London, America/New_York or Etc/UTC.");
        }
        return errors;
    }

    /// <summary>The roll these settings describe; throws <see cref="InvalidOperationException"/> naming the keys when invalid.</summary>
    public BusinessDayRoll ToRoll()
    {
        var errors = Validate();
        if (errors.Count > 0)
        {
            throw new InvalidOperationException(string.Join(" ", errors));
        }
        TryParseTime(RollTime, out var time);
        TryFindZone(TimeZone, out var zone);
        return new BusinessDayRoll(time, zone!);
    }

    private static bool TryParseTime(string? text, out TimeOnly time) =>
        TimeOnly.TryParseExact(text, ["HH:mm", "HH:mm:ss"], CultureInfo.InvariantCulture, DateTimeStyles.None, out time);

    private static bool TryFindZone(string? id, out TimeZoneInfo? zone)
    {
        zone = null;
        if (string.IsNullOrWhiteSpace(id) || !System.TimeZoneInfo.TryFindSystemTimeZoneById(id, out zone))
        {
            return false;
        }
        // IANA names only (the same everywhere); a Windows name would be read differently on another machine.
        return zone.HasIanaId;
    }
}
