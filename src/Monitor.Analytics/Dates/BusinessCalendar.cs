namespace Monitor.Analytics.Dates;

/// <summary>
/// A business-day calendar: Saturdays and Sundays plus a list of holidays (per currency, from configuration).
/// </summary>
public sealed class BusinessCalendar
{
    private readonly HashSet<DateOnly> _holidays;

    public BusinessCalendar(string name, IEnumerable<DateOnly> holidays)
    {
        ArgumentNullException.ThrowIfNull(holidays);
        if (string.IsNullOrWhiteSpace(name))
        {
            throw new ArgumentException($"Calendar name must not be blank; name = '{name}'.", nameof(name));
        }

        Name = name;
        _holidays = [.. holidays];
    }

    /// <summary>A calendar with weekends only.</summary>
    public static BusinessCalendar WeekendsOnly { get; } = new("WEEKENDS", []);

    public string Name { get; }

    public IReadOnlyCollection<DateOnly> Holidays => _holidays;

    public bool IsBusinessDay(DateOnly date) =>
        date.DayOfWeek is not (DayOfWeek.Saturday or DayOfWeek.Sunday) && !_holidays.Contains(date);

    /// <summary>The first business day strictly after <paramref name="date"/>.</summary>
    public DateOnly NextBusinessDay(DateOnly date)
    {
        var d = date.AddDays(1);
        while (!IsBusinessDay(d))
        {
            d = d.AddDays(1);
        }

        return d;
    }

    /// <summary>
    /// <paramref name="date"/> moved to a business day (following), then <paramref name="days"/> business days on
    /// (back for negative values).
    /// </summary>
    public DateOnly AddBusinessDays(DateOnly date, int days)
    {
        var d = date;
        var step = days >= 0 ? 1 : -1;
        while (!IsBusinessDay(d))
        {
            d = d.AddDays(step);
        }

        for (var left = Math.Abs(days); left > 0; left--)
        {
            d = d.AddDays(step);
            while (!IsBusinessDay(d))
            {
                d = d.AddDays(step);
            }
        }

        return d;
    }

    /// <summary>
    /// Settlement date of a trade done on <paramref name="tradeDate"/>: T + <paramref name="lagBusinessDays"/> business
    /// days. A trade on a non-business day is treated as done on the next business day (common practice, no source).
    /// </summary>
    public DateOnly SettlementDate(DateOnly tradeDate, int lagBusinessDays)
    {
        if (lagBusinessDays < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(lagBusinessDays), lagBusinessDays, $"Settlement lag must be zero or more business days; lagBusinessDays = {lagBusinessDays}.");
        }

        return AddBusinessDays(tradeDate, lagBusinessDays);
    }
}
