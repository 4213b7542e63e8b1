namespace Monitor.Service.Audit;

/// <summary>A line read back: the record when its members could be read, and whether its hash holds.</summary>
/// <param name="Record">The record, null when the line is unparsable.</param>
/// <param name="Error">Why the line is unparsable, null otherwise.</param>
/// <param name="HashMatches">True when the stored hash equals SHA-256 of the canonical bytes.</param>
/// <param name="ComputedHash">SHA-256 of the canonical bytes, null when unparsable.</param>
internal readonly record struct ParsedLine(ExposureLogRecord? Record, string? Error, bool HashMatches, string? ComputedHash);
