using Monitor.Analytics.Dates;

namespace Monitor.Cli.Demo;

/// <summary>
/// The script of the invented demo day at Pellowmere Capital (all names invented): quote bursts every ten simulated
/// minutes from 08:00 to 17:00 UTC on Monday 2026-06-01 (valuation date, the spot date, 2026-06-02); rates sell off
/// through the day and INDUSTRIAL-BBB widens around midday (<see cref="MarketPath"/>); one fat-fingered quote at 12:00 that
/// the fitter should leave out as an outlier; and the trades below. At speed 1 the day lasts about a minute.
/// </summary>
internal sealed class DemoScenario
{
    public static readonly DateOnly TradeDate = new(2026, 6, 1);

    public static readonly TimeSpan Open = TimeSpan.FromHours(8);

    public static readonly TimeSpan Close = TimeSpan.FromHours(17);

    public static readonly TimeSpan BurstEvery = TimeSpan.FromMinutes(10);

    /// <summary>Simulated seconds per real second at speed 1: nine hours in one minute.</summary>
    public const double BaseRate = 9 * 3600 / 60.0;

    /// <summary>The fat-fingered quote: a government bond quoted this many points too low at <see cref="FatFingerAt"/>.</summary>
    public const double FatFingerPoints = 6.0;

    public const string FatFingerInstrument = "VGB-2041-05";

    public static readonly TimeSpan FatFingerAt = new(12, 0, 0);

    public static DateOnly ValuationDate => BusinessCalendar.WeekendsOnly.SettlementDate(TradeDate, 1);

    public static DateTimeOffset At(TimeSpan timeOfDay) => new(TradeDate.ToDateTime(TimeOnly.MinValue).Add(timeOfDay), TimeSpan.Zero);

    public static DateTimeOffset DayStart => At(Open);

    public static DateTimeOffset DayEnd => At(Close);

    /// <summary>Fraction of the trading day elapsed at <paramref name="time"/>, clamped to [0, 1].</summary>
    public static double DayFraction(DateTimeOffset time) => Math.Clamp((time - DayStart) / (DayEnd - DayStart), 0.0, 1.0);

    public static int BurstCount => (int)((Close - Open) / BurstEvery) + 1;

    /// <summary>The day's trades in time order.</summary>
    public static IReadOnlyList<ScenarioTrade> Trades { get; } =
    [
        new(new TimeSpan(9, 35, 0), "PLM-0001", "RATES-CORE", "VGB-2034-11", 12_000_000, "RATES-CORE adds 10y duration into the open"),
        new(new TimeSpan(11, 5, 0), "PLM-0002", "CREDIT-IG", "KWS-2030-09", 9_000_000, "CREDIT-IG buys the INDUSTRIAL-BBB dip"),
        new(new TimeSpan(13, 15, 0), "PLM-0003", "RATES-CURVE", "VGB-2051-11", 30_000_000, "RATES-CURVE: large long-end buy"),
        new(new TimeSpan(14, 45, 0), "PLM-0004", "RATES-CURVE", "VGB-2051-11", -26_000_000, "RATES-CURVE cuts the long-end position"),
    ];
}
