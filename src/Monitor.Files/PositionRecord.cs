namespace Monitor.Files;

/// <summary>One row of a positions file: a signed face amount of an instrument held in a book.</summary>
public sealed record PositionRecord(string Book, string InstrumentId, double FaceAmount);
