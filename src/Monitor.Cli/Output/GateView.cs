namespace Monitor.Cli.Output;

/// <summary>JSON: a quality gate (bp of yield, instrument count) and its verdict; <c>reasons</c> lists each failed condition.</summary>
internal sealed record GateView(double MaxRmseBp, double MaxAbsErrorBp, int MinInstruments, bool Passed, IReadOnlyList<string> Reasons);
