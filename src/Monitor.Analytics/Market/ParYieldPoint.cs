namespace Monitor.Analytics.Market;

/// <summary>A published par yield (decimal, bond-equivalent) at a tenor in years, e.g. 0.25 for 3M.</summary>
public readonly record struct ParYieldPoint(double TenorYears, double ParYield);
