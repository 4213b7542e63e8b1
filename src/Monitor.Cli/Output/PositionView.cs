namespace Monitor.Cli.Output;

/// <summary>JSON: one position (signed face in currency units) and its exposures on its own curves.</summary>
internal sealed record PositionView(string Book, string InstrumentId, string? SpreadGroup, double FaceAmount, ExposureView Exposures);
