namespace Monitor.Service.Engine;

/// <summary>
/// When one business day ends and the next begins: a local time of day in a time zone (the roll). Pure: the
/// moment comes in as a parameter. A business day runs from one roll to the next and is named after the calendar
/// date that holds most of it: with a roll at or after 12:00 the day that starts at 17:00 on 1 June is
/// 2 June (the evening belongs to the next day); with a roll before 12:00 the day that starts at 02:00 on 2 June
/// is 2 June (the small hours belong to the day before). A roll at 00:00 gives plain local dates
/// (common practice, no source).
/// Daylight saving: a roll time the clocks skip (spring forward) happens at the end of the gap; one they repeat
/// (fall back) happens at its first occurrence. Business dates therefore never run backwards.
/// </summary>
public sealed class BusinessDayRoll
{
    private static readonly TimeSpan Noon = TimeSpan.FromHours(12);

    public BusinessDayRoll(TimeOnly rollTime, TimeZoneInfo zone)
    {
        ArgumentNullException.ThrowIfNull(zone);
        RollTime = rollTime;
        Zone = zone;
    }

    /// <summary>Midnight UTC: business dates are UTC dates.</summary>
    public static BusinessDayRoll UtcMidnight { get; } = new(TimeOnly.MinValue, TimeZoneInfo.Utc);

    public TimeOnly RollTime { get; }

    public TimeZoneInfo Zone { get; }

    /// <summary>The business date of a moment.</summary>
    public DateOnly BusinessDateOf(DateTimeOffset moment)
    {
        var local = TimeZoneInfo.ConvertTime(moment, Zone);
        // First guess from the local clock, then corrected against the roll moments (which settle DST gaps and repeats).
        var guess = DateOnly.FromDateTime(local.DateTime - RollTime.ToTimeSpan());
        if (RollTime.ToTimeSpan() >= Noon)
        {
            guess = guess.AddDays(1);
        }
        if (moment < EndOf(guess.AddDays(-1)))
        {
            return guess.AddDays(-1);
        }
        return moment >= EndOf(guess) ? guess.AddDays(1) : guess;
    }

    /// <summary>The moment business day <paramref name="businessDate"/> ends (the roll into the next day).</summary>
    public DateTimeOffset EndOf(DateOnly businessDate)
    {
        var startDate = RollTime.ToTimeSpan() >= Noon ? businessDate.AddDays(-1) : businessDate;
        var local = startDate.AddDays(1).ToDateTime(RollTime, DateTimeKind.Unspecified);
        if (Zone.IsInvalidTime(local))
        {
            // Skipped by a spring-forward: the roll happens when the clocks jump, i.e. at the end of the gap.
            var before = local;
            while (Zone.IsInvalidTime(before))
            {
                before = before.AddMinutes(-1);
            }
            var jumpUtc = new DateTimeOffset(before, Zone.GetUtcOffset(before)).AddMinutes(1);
            return jumpUtc.ToUniversalTime();
        }
        var offset = Zone.IsAmbiguousTime(local) ? Zone.GetAmbiguousTimeOffsets(local).Max() : Zone.GetUtcOffset(local);
        return new DateTimeOffset(local, offset).ToUniversalTime();
    }

    /// <summary>The first roll after <paramref name="moment"/>: the end of its business day.</summary>
    public DateTimeOffset NextRollAfter(DateTimeOffset moment) => EndOf(BusinessDateOf(moment));

    public override string ToString() => $"{RollTime:HH\\:mm} {Zone.Id}";
}
