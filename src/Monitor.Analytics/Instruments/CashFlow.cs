namespace Monitor.Analytics.Instruments;

/// <summary>A dated cash flow: an amount (per 100 face unless stated) paid on <see cref="Date"/>.</summary>
public readonly record struct CashFlow(DateOnly Date, double Amount);
