namespace Monitor.Cli.Demo;

/// <summary>One limit in the demo view: exposure and bound in the measure's units, use as a fraction (1 = 100%).</summary>
internal sealed record LimitRow(string Id, string Scope, string Measure, double Exposure, double? Bound, double Use, string Status);
