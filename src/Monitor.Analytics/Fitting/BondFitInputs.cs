using System.Globalization;
using Monitor.Analytics.Curves;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;
using Monitor.Analytics.Pricing;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// From bond quotes to curve-fit inputs, shared by the service's risk engine and the command line:
/// the settlement date a quote is for, the priced quote (dirty price, flows from settlement, duration weight)
/// and the reasons a quote is left out of a fit (matured, stale).
/// </summary>
public static class BondFitInputs
{
    /// <summary>
    /// The settlement date of <paramref name="bond"/> for the trade date that <paramref name="valuationDate"/> is the
    /// spot date of: trade date = the business day before the valuation date, settlement = trade date + the bond's
    /// own lag. A government bond with lag 1 settles on the valuation date; other lags a day or two apart
    /// (common practice, no source). Weekends-only calendar unless one is given.
    /// </summary>
    public static DateOnly SettlementDate(Bond bond, DateOnly valuationDate, BusinessCalendar? calendar = null)
    {
        ArgumentNullException.ThrowIfNull(bond);
        var cal = calendar ?? BusinessCalendar.WeekendsOnly;
        var tradeDate = valuationDate.AddDays(-1);
        while (!cal.IsBusinessDay(tradeDate))
        {
            tradeDate = tradeDate.AddDays(-1);
        }
        return cal.SettlementDate(tradeDate, bond.SettlementLagDays);
    }

    /// <summary>
    /// The spot date of <paramref name="tradeDate"/>: the next business day (T+1), the default valuation date of a
    /// set of quotes taken on that date (common practice for government bonds, no source).
    /// </summary>
    public static DateOnly SpotDate(DateOnly tradeDate, BusinessCalendar? calendar = null) =>
        (calendar ?? BusinessCalendar.WeekendsOnly).SettlementDate(tradeDate, 1);

    /// <summary>
    /// Prices a quote at <paramref name="settlement"/>: from its clean mid (mid, or bid/ask average) the yield, or
    /// from its yield the clean price; dirty = clean + accrued; modified duration at the yield; flows after
    /// settlement in ACT/365F years from settlement. Throws <see cref="ArgumentException"/> when the bond has
    /// matured by settlement, the quote is for another bond, or the price gives no yield (message names the value).
    /// </summary>
    public static PricedBondQuote Price(Bond bond, BondQuote quote, DateOnly settlement)
    {
        ArgumentNullException.ThrowIfNull(bond);
        ArgumentNullException.ThrowIfNull(quote);
        if (!string.Equals(bond.Id, quote.InstrumentId, StringComparison.Ordinal))
        {
            throw new ArgumentException($"Quote for '{quote.InstrumentId}' cannot price bond '{bond.Id}'.", nameof(quote));
        }
        if (bond.MaturityDate <= settlement)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"Bond '{bond.Id}' matured on {bond.MaturityDate:yyyy-MM-dd}, on or before settlement {settlement:yyyy-MM-dd}."),
                nameof(bond));
        }
        double clean;
        double yield;
        if (quote.CleanMid is { } mid)
        {
            clean = mid;
            yield = BondYield.FromCleanPrice(bond, settlement, clean);
        }
        else
        {
            yield = quote.Yield!.Value;
            clean = BondYield.CleanPrice(bond, settlement, yield);
        }
        var measures = BondYield.Measures(bond, settlement, yield);
        var flows = bond.CashFlowsAfter(settlement);
        var times = new double[flows.Count];
        var amounts = new double[flows.Count];
        for (var i = 0; i < flows.Count; i++)
        {
            times[i] = CurveTime.YearsBetween(settlement, flows[i].Date);
            amounts[i] = flows[i].Amount;
        }
        return new PricedBondQuote(quote, bond, settlement, clean, clean + measures.AccruedInterest, yield, measures.ModifiedDuration, times, amounts);
    }

    /// <summary>
    /// Why a quote should stay out of a fit, or null to use it: <see cref="FitExclusionReason.Matured"/> when the bond
    /// matures on or before <paramref name="valuationDate"/>; <see cref="FitExclusionReason.Stale"/> when the quote is
    /// older than <paramref name="staleAfter"/> at <paramref name="now"/>.
    /// </summary>
    public static FitExclusion? Exclusion(Bond bond, DateTimeOffset quoteTime, DateOnly valuationDate, DateTimeOffset now, TimeSpan staleAfter)
    {
        ArgumentNullException.ThrowIfNull(bond);
        if (bond.MaturityDate <= valuationDate)
        {
            return new FitExclusion(bond.Id, FitExclusionReason.Matured, string.Create(CultureInfo.InvariantCulture, $"matured {bond.MaturityDate:yyyy-MM-dd}"));
        }
        if (now - quoteTime > staleAfter)
        {
            return new FitExclusion(bond.Id, FitExclusionReason.Stale,
                string.Create(CultureInfo.InvariantCulture, $"quoted {quoteTime:O}, older than {staleAfter}"));
        }
        return null;
    }
}
