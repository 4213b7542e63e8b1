using Monitor.Analytics.Fitting;

namespace Monitor.Files;

/// <summary>The par yields of one date, sorted by tenor.</summary>
public sealed record ParYieldSet(DateOnly AsOf, IReadOnlyList<ParYieldPoint> Points);
