using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Analytics.Pricing;

namespace Monitor.Service.Engine;

/// <summary>
/// The spread a bond is valued on while its spread group has no fitted curve: a flat spread over the government curve
/// solved from the bond's own price (<see cref="FlatSpread"/>), its newest quote first, else its last trade price. A
/// bond with neither is valued on the government curve alone. Every figure so built is provisional, and the reason
/// says which bond, which price and which spread.
/// </summary>
internal static class StandInSpread
{
    /// <param name="bond">The bond held.</param>
    /// <param name="valuationDate">The engine's valuation date.</param>
    /// <param name="government">The fitted government curve.</param>
    /// <param name="quote">The bond's newest quote, or null.</param>
    /// <param name="lastTrade">The bond's last traded clean price and trade time, or null.</param>
    public static (IFactorCurve Spread, string Reason) For(
        Bond bond, DateOnly valuationDate, IFactorCurve government, PricedQuote? quote, (double CleanPrice, DateTimeOffset Time)? lastTrade)
    {
        var group = $"spread group {bond.SpreadGroup} has no fitted curve";
        string source;
        double[] times, amounts;
        double dirty;
        if (quote is not null)
        {
            source = $"its quote of {Iso(quote.Quote.QuoteTime)}";
            (times, amounts, dirty) = (quote.Times, quote.Amounts, quote.DirtyPrice);
        }
        else if (lastTrade is { } trade)
        {
            source = string.Create(CultureInfo.InvariantCulture, $"its last trade price {trade.CleanPrice:G6} of {Iso(trade.Time)}");
            try
            {
                var settlement = BondFitInputs.SettlementDate(bond, valuationDate);
                var priced = BondFitInputs.Price(bond, new BondQuote(bond.Id, trade.Time, null, null, trade.CleanPrice, null, "trade"), settlement);
                (times, amounts, dirty) = (priced.Times, priced.Amounts, priced.DirtyPrice);
            }
            catch (ArgumentException ex)
            {
                return (new FlatSpreadCurve(0), $"{group}; {bond.Id}: {source} cannot be priced ({ex.Message}): valued on the government curve with no spread");
            }
        }
        else
        {
            return (new FlatSpreadCurve(0), $"{group}; {bond.Id} has no quote or trade price: valued on the government curve with no spread");
        }
        try
        {
            var spread = FlatSpread.Solve(government, times, amounts, dirty);
            return (new FlatSpreadCurve(spread),
                string.Create(CultureInfo.InvariantCulture, $"{group}; {bond.Id} valued on the government curve + {spread * 1e4:F1} bp flat spread from {source}"));
        }
        catch (ArgumentException ex)
        {
            return (new FlatSpreadCurve(0), $"{group}; {bond.Id}: {source} gives no flat spread ({ex.Message}): valued on the government curve with no spread");
        }
    }

    private static string Iso(DateTimeOffset time) => time.ToString("yyyy-MM-dd'T'HH:mm:ssK", CultureInfo.InvariantCulture);
}
