namespace Monitor.Analytics.Fitting;

/// <summary>
/// A published par yield at a tenor: <see cref="TenorYears"/> in years (1M = 1/12), <see cref="ParYield"/> a decimal
/// (0.0425 = 4.25%), bond-equivalent (semiannual). Null or NaN marks a tenor not published that day.
/// </summary>
public readonly record struct ParYieldPoint(double TenorYears, double? ParYield);
