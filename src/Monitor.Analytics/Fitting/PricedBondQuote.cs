using Monitor.Analytics.Instruments;
using Monitor.Analytics.Market;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// A bond quote turned into what a curve fit needs (<see cref="BondFitInputs.Price"/>): clean and dirty price per 100
/// face at the bond's <see cref="Settlement"/> date, the street-convention yield (decimal), the modified duration at
/// that yield (years; it weights the price error), and the cash flows after settlement as curve times (ACT/365F years
/// from settlement) and amounts per 100 face.
/// </summary>
public sealed record PricedBondQuote(
    BondQuote Quote,
    Bond Bond,
    DateOnly Settlement,
    double CleanPrice,
    double DirtyPrice,
    double Yield,
    double ModifiedDuration,
    double[] Times,
    double[] Amounts)
{
    /// <summary>The fitter's view of this quote: id, flows, dirty price, duration weight.</summary>
    public FitInstrument ToFitInstrument() => new(Bond.Id, Times, Amounts, DirtyPrice, ModifiedDuration);
}
