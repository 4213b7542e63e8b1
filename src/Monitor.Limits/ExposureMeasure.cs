namespace Monitor.Limits;

/// <summary>
/// A risk figure a limit can bound. Every figure is a money amount in the book's reporting
/// currency, summed over positions (book), books (desk) and desks (firm).
/// </summary>
/// <remarks>
/// Sign conventions (domain primer, "Factor durations and convexities"): a long bond position has
/// a positive market value, a positive DV01 and positive factor exposures, because each
/// per-bp figure is the value LOST when the yield or factor RISES by 1 bp
/// (D_k x P x 1e-4 x face/100). A short position has negative figures.
/// </remarks>
public enum ExposureMeasure
{
    /// <summary>Dirty market value; money.</summary>
    MarketValue,

    /// <summary>Value change for a 1 bp parallel fall in yields; money per bp.</summary>
    Dv01,

    /// <summary>Value lost when the base curve's level factor (b0) rises 1 bp; money per bp.</summary>
    BaseLevel,

    /// <summary>Value lost when the base curve's slope factor (b1) rises 1 bp; money per bp.</summary>
    BaseSlope,

    /// <summary>Value lost when the base curve's curvature factor (b2) rises 1 bp; money per bp.</summary>
    BaseCurvature,

    /// <summary>Value lost when the spread curve's level factor (g0) rises 1 bp; money per bp.</summary>
    SpreadLevel,

    /// <summary>Value lost when the spread curve's slope factor (g1) rises 1 bp; money per bp.</summary>
    SpreadSlope,

    /// <summary>Value lost when the spread curve's curvature factor (g2) rises 1 bp; money per bp.</summary>
    SpreadCurvature,

    /// <summary>Dollar convexity, C x P, expressed for a 1 bp move (C x P x 1e-8); money per bp squared.</summary>
    Convexity,
}
