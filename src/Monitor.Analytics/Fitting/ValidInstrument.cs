namespace Monitor.Analytics.Fitting;

/// <summary>An instrument after validation: only flows at t &gt; 0, finite positive price and duration.</summary>
internal sealed record ValidInstrument(string Id, double[] Times, double[] Amounts, double DirtyPrice, double Duration);
