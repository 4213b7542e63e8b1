namespace Monitor.Analytics.Fitting;

/// <summary>Why an instrument was left out of a fit.</summary>
public enum FitExclusionReason
{
    /// <summary>The quote is older than the caller accepts.</summary>
    Stale,

    /// <summary>The fitter dropped it: its residual was far outside the robust spread of the others.</summary>
    Outlier,

    /// <summary>No cash flow remains after the valuation date.</summary>
    Matured,

    /// <summary>Not known to the caller's reference data.</summary>
    Unknown,

    /// <summary>Inputs unusable for a fit.</summary>
    Invalid,
}
