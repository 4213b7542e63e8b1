namespace Monitor.Service.Engine;

/// <summary>
/// What fits the government curve the books are valued on (<c>Monitor:ValuationCurveSource</c>). The other source fits
/// its own reference curve, published under its own curve id and never used for figures: two sources on one curve made
/// it flip between two fits.
/// </summary>
public enum ValuationCurveSource
{
    /// <summary>Government bond quotes (default); par yields fit the reference curve <c>government-par</c>.</summary>
    BondQuotes,

    /// <summary>Par yields; government bond quotes fit the reference curve <c>government-bonds</c>.</summary>
    ParYields,
}
