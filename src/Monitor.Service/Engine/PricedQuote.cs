using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;

namespace Monitor.Service.Engine;

/// <summary>
/// A quote turned into what the fitter needs, once, when it arrives: dirty price, the bond's cash flows
/// in years from its settlement date, and the modified duration that weights its price error.
/// </summary>
public sealed record PricedQuote(BondQuote Quote, Bond Bond, DateOnly Settlement, double CleanPrice, double DirtyPrice, double Yield, double ModifiedDuration, double[] Times, double[] Amounts);
