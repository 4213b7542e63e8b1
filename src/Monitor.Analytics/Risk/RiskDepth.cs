namespace Monitor.Analytics.Risk;

/// <summary>Which moments a batch risk pass computes.</summary>
public enum RiskDepth
{
    /// <summary>Value and first moments only: DV01 and every factor duration (the per-tick figures limits read).</summary>
    Durations,

    /// <summary>Value, first moments and all (cross-)convexities (for P&amp;L explain; costs about 3 to 4 times more).</summary>
    Full,
}
