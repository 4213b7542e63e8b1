namespace Monitor.Cli.Demo;

/// <summary>One curve in the demo view: version in force, RMSE (bp of yield) of the last fit attempt, and whether that attempt was refused.</summary>
internal sealed record CurveRow(string Curve, int Version, double? RmseBp, bool LastRejected);
