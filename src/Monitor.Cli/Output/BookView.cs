namespace Monitor.Cli.Output;

/// <summary>
/// JSON: one book. <c>exposures</c> come from the book ledger (cash flows merged by date, one pass over the dates);
/// <c>sumOfPositions</c> adds the position figures; <c>maxAbsDifference</c> is the largest gap between the two
/// over value, DV01, the money-per-bp figures and the money convexity (money).
/// </summary>
internal sealed record BookView(string Book, int Positions, ExposureView Exposures, ExposureView SumOfPositions, double MaxAbsDifference);
