namespace Monitor.Service.Audit;

/// <summary>A line read back: the record when its members could be read, and whether its MAC holds.</summary>
/// <param name="Record">The record, null when the line is unparsable.</param>
/// <param name="Error">Why the line is unparsable, null otherwise.</param>
/// <param name="MacMatches">True when the stored mac equals HMAC-SHA256 of the canonical bytes under the key.</param>
/// <param name="ComputedMac">HMAC-SHA256 of the canonical bytes under the key, null when unparsable.</param>
internal readonly record struct ParsedLine(ExposureLogRecord? Record, string? Error, bool MacMatches, string? ComputedMac);
