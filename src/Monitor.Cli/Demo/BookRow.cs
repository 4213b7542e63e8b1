namespace Monitor.Cli.Demo;

/// <summary>One book in the demo view: value in XTS, the per-bp figures in XTS per bp, and the highest use of its own limits (1 = 100%).</summary>
internal sealed record BookRow(string Book, string Desk, double Value, double Dv01, double BaseLevel, double BaseSlope, double BaseCurvature, double SpreadLevel, double MaxUse, string Status);
