using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;

namespace Monitor.Service.Engine;

/// <summary>
/// One curve the engine maintains: the government (base) curve under key "" or a spread group's curve.
/// Holds the latest quote per bond (conflation: a burst of quotes leaves only the newest), the last good fit
/// and whether new quotes wait for a refit.
/// </summary>
public sealed class CurveState
{
    public CurveState(string key) => Key = key;

    public string Key { get; }

    public Dictionary<string, PricedQuote> LatestQuotes { get; } = new(StringComparer.Ordinal);

    /// <summary>The last fit that passed the quality gate, or null before the first.</summary>
    public CurveFitResult? Current { get; set; }

    /// <summary>Increases with every published fit; identifies the curve used in events.</summary>
    public int Version { get; set; }

    public DateTimeOffset? FittedAt { get; set; }

    /// <summary>The latest fit report, good or rejected.</summary>
    public FitReport? LastReport { get; set; }

    public bool LastFitRejected { get; set; }

    /// <summary>Quotes arrived since the last fit.</summary>
    public bool Dirty { get; set; }

    public IFactorCurve? Curve => Current?.Curve;

    public string Label => CurveKeyLabel.Of(Key);
}
