using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Pricing;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>
/// Prices the demo bonds on the true curves of <see cref="MarketPath"/> with the library (curve price, then
/// clean = dirty - accrued) and adds seeded noise in yield: 0.4 bp for government bonds, 1.5 bp for credit.
/// Bid and ask sit a fixed half-spread around the mid (0.02 points government, 0.08 credit), rounded to 0.001.
/// </summary>
internal sealed class QuoteFactory(IReadOnlyList<Bond> bonds, MarketPath market, Random random)
{
    public IReadOnlyList<Bond> Bonds { get; } = bonds;

    /// <summary>Settlement of a quote on the demo's trade date: the bond's lag in business days (as the engine settles it).</summary>
    public static DateOnly SettlementOf(Bond bond) => BusinessCalendar.WeekendsOnly.SettlementDate(DemoScenario.TradeDate, bond.SettlementLagDays);

    /// <summary>Clean price per 100 face on the true curve at <paramref name="time"/>, shifted by <paramref name="yieldShift"/> (decimal).</summary>
    public double CleanPrice(Bond bond, DateTimeOffset time, int step, double yieldShift = 0.0)
    {
        var f = DemoScenario.DayFraction(time);
        IZeroCurve curve = market.Government(f, step);
        if (bond.SpreadGroup is { Length: > 0 } group)
        {
            curve = new SpreadedCurve(curve, market.Spread(group, f));
        }
        if (yieldShift != 0.0)
        {
            curve = new ParallelShiftedCurve(curve, yieldShift);
        }
        var settlement = SettlementOf(bond);
        var dirty = CurvePricing.DirtyPrice(bond, curve, DemoScenario.ValuationDate, settlement);
        return dirty - bond.AccruedInterest(settlement);
    }

    /// <summary>One quote for <paramref name="bond"/> at <paramref name="time"/>, with noise; <paramref name="priceError"/> points are added to both sides (a fat finger).</summary>
    public BondQuoted Quote(Bond bond, DateTimeOffset time, int step, double priceError = 0.0)
    {
        var credit = bond.SpreadGroup is { Length: > 0 };
        var noise = (credit ? 0.00015 : 0.00004) * Gaussian.Next(random);
        var mid = CleanPrice(bond, time, step, noise) + priceError;
        var half = credit ? 0.08 : 0.02;
        return new BondQuoted
        {
            QuoteId = string.Create(CultureInfo.InvariantCulture, $"{bond.Id}@{time:HHmmss}"),
            InstrumentId = bond.Id,
            BidCleanPrice = Math.Round(mid - half, 3),
            AskCleanPrice = Math.Round(mid + half, 3),
            QuoteTime = time,
            Source = "demo-feed",
        };
    }

    /// <summary>The bonds in a seeded random order (a burst does not arrive sorted).</summary>
    public Bond[] Shuffled()
    {
        var order = Bonds.ToArray();
        random.Shuffle(order);
        return order;
    }
}
