using Monitor.Analytics.Curves;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Analytics.Pricing;

namespace Monitor.Analytics.Tests.Fitting;

/// <summary>
/// The spread groups of the invented demo day (src/Monitor.Cli/Demo, config/demo/instruments.csv), rebuilt here because
/// the test project does not reference the command line: the same five bonds per group, the same "true" curves
/// (MarketPath: government and spread Nelson-Siegel curves as functions of the day fraction f), the same quote recipe
/// (QuoteFactory: 1.5 bp of seeded Gaussian yield noise on credit, bid/ask 0.08 points around the mid, rounded to 0.001)
/// and the engine's pricing of a quote (BondFitInputs.Price). Invented data only.
/// </summary>
internal static class DemoSpreadQuotes
{
    public static readonly DateOnly TradeDate = new(2026, 6, 1);

    public static readonly DateOnly ValuationDate = new(2026, 6, 2);

    public static readonly Bond[] UtilA =
    [
        Credit("QFU-2029-03", "UTIL-A", 3.800m, new(2024, 3, 1), new(2029, 3, 1)),
        Credit("QFU-2033-09", "UTIL-A", 4.250m, new(2023, 9, 1), new(2033, 9, 1)),
        Credit("SRT-2031-06", "UTIL-A", 4.100m, new(2021, 6, 1), new(2031, 6, 1)),
        Credit("LKW-2030-04", "UTIL-A", 3.600m, new(2025, 4, 1), new(2030, 4, 1)),
        Credit("LKW-2036-10", "UTIL-A", 4.400m, new(2024, 10, 1), new(2036, 10, 1)),
    ];

    public static readonly Bond[] IndustrialBbb =
    [
        Credit("BHS-2028-12", "INDUSTRIAL-BBB", 5.000m, new(2023, 12, 1), new(2028, 12, 1)),
        Credit("BHS-2032-06", "INDUSTRIAL-BBB", 5.500m, new(2022, 6, 1), new(2032, 6, 1)),
        Credit("KWS-2035-03", "INDUSTRIAL-BBB", 5.750m, new(2025, 3, 1), new(2035, 3, 1)),
        Credit("KWS-2030-09", "INDUSTRIAL-BBB", 5.250m, new(2025, 9, 1), new(2030, 9, 1)),
        Credit("HMC-2033-03", "INDUSTRIAL-BBB", 5.400m, new(2023, 3, 1), new(2033, 3, 1)),
    ];

    /// <summary>The demo's quote bursts: every ten minutes from 08:00 to 17:00, step 0..54, f = step / 54.</summary>
    public const int LastStep = 54;

    /// <summary>MarketPath.Government without its 0.3 bp random walk (the spread fit sees the government curve only as its base).</summary>
    public static NelsonSiegelCurve Government(double f)
    {
        var selloff = Smooth(f, 0.10, 0.75);
        return new NelsonSiegelCurve(0.0445 + 0.0035 * selloff, -0.0150 - 0.0005 * selloff, -0.0060, 2.2);
    }

    /// <summary>MarketPath.Spread.</summary>
    public static NelsonSiegelCurve Spread(string group, double f) => group switch
    {
        "UTIL-A" => new NelsonSiegelCurve(0.0095 + 0.0003 * Smooth(f, 0.2, 0.8), -0.0035, 0.0010, 2.5),
        "INDUSTRIAL-BBB" => new NelsonSiegelCurve(0.0210 + 0.0045 * Smooth(f, 0.28, 0.55), -0.0060, 0.0020, 2.5),
        _ => throw new ArgumentException($"spread group '{group}' is not a demo group.", nameof(group)),
    };

    /// <summary>
    /// One burst of quotes for <paramref name="bonds"/> at day fraction <paramref name="f"/>, as fit inputs; priced on
    /// <paramref name="group"/>'s spread curve if given (a larger invented group), else on each bond's own.
    /// </summary>
    public static List<FitInstrument> Burst(IEnumerable<Bond> bonds, double f, Random random, string? group = null) =>
        bonds.Select(b => Quote(b, f, random, group ?? b.SpreadGroup!)).ToList();

    private static FitInstrument Quote(Bond bond, double f, Random random, string group)
    {
        var quoteSettlement = BusinessCalendar.WeekendsOnly.SettlementDate(TradeDate, bond.SettlementLagDays);
        var noise = 0.00015 * Gaussian(random);
        IZeroCurve curve = new ParallelShiftedCurve(new SpreadedCurve(Government(f), Spread(group, f)), noise);
        var mid = CurvePricing.DirtyPrice(bond, curve, ValuationDate, quoteSettlement) - bond.AccruedInterest(quoteSettlement);
        var quote = new BondQuote(bond.Id, new DateTimeOffset(2026, 6, 1, 12, 0, 0, TimeSpan.Zero), Math.Round(mid - 0.08, 3), Math.Round(mid + 0.08, 3), null, null, "test");
        var priced = BondFitInputs.Price(bond, quote, BondFitInputs.SettlementDate(bond, ValuationDate));
        return new FitInstrument(bond.Id, priced.Times, priced.Amounts, priced.DirtyPrice, priced.ModifiedDuration);
    }

    // Box-Muller, as the demo's Gaussian.
    private static double Gaussian(Random random)
    {
        var u1 = 1.0 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    private static double Smooth(double f, double from, double to)
    {
        var x = Math.Clamp((f - from) / (to - from), 0.0, 1.0);
        return x * x * (3 - 2 * x);
    }

    private static Bond Credit(string id, string group, decimal couponPct, DateOnly issue, DateOnly maturity) =>
        new(id, "Invented issuer", group, "XTS", couponPct / 100m, 2, DayCountConvention.Thirty360BondBasis, issue, null, maturity);
}
