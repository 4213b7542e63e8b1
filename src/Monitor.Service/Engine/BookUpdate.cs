using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>A book's recomputed figures: the limit measures and the full factor exposures behind them.</summary>
public sealed record BookUpdate(string Book, BookExposures Exposures, BookRisk Risk);
