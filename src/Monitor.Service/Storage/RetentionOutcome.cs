namespace Monitor.Service.Storage;

/// <summary>What one retention run did: files moved to the archive, and older days left in place with the reason.</summary>
public sealed record RetentionOutcome(IReadOnlyList<(string From, string To)> Moved, IReadOnlyList<(DateOnly Day, string Why)> Kept);
