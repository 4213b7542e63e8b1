using System.Collections.ObjectModel;

namespace Monitor.Limits;

/// <summary>
/// One book's figures: <see cref="Totals"/> over all its positions, and optionally the same figures
/// restricted to the bonds of each spread group (for limits filtered by spread group). Money, or
/// money per bp, per <see cref="ExposureMeasure"/>. A missing measure or group counts 0.
/// </summary>
public sealed record BookExposures
{
    public required IReadOnlyDictionary<ExposureMeasure, double> Totals { get; init; }

    /// <summary>Spread group -&gt; the book's figures on the bonds of that group only.</summary>
    /// <remarks>Empty by default: one shared read-only instance, not a dictionary per record (a refit makes a thousand).</remarks>
    public IReadOnlyDictionary<string, IReadOnlyDictionary<ExposureMeasure, double>> BySpreadGroup { get; init; } =
        ReadOnlyDictionary<string, IReadOnlyDictionary<ExposureMeasure, double>>.Empty;

    /// <summary>Totals only, no spread-group breakdown.</summary>
    public static BookExposures FromTotals(IReadOnlyDictionary<ExposureMeasure, double> totals) => new() { Totals = totals };

    /// <summary>The figure for the measure, over all positions (group null) or one spread group; 0 when absent.</summary>
    public double Get(ExposureMeasure measure, string? spreadGroup = null)
    {
        var figures = spreadGroup is null ? Totals : BySpreadGroup.GetValueOrDefault(spreadGroup);
        return figures is not null && figures.TryGetValue(measure, out var value) ? value : 0.0;
    }

    /// <summary>
    /// A copy that later changes to the caller's dictionaries cannot reach. Figures already immutable
    /// (<see cref="MeasureFigures"/>) are shared, not copied: the whole record when nothing in it can change.
    /// </summary>
    internal BookExposures Snapshot()
    {
        if (Totals is MeasureFigures && BySpreadGroup.Count == 0)
        {
            return this;
        }
        return new()
        {
            Totals = Frozen(Totals),
            BySpreadGroup = BySpreadGroup.ToDictionary(kv => kv.Key, kv => Frozen(kv.Value), StringComparer.Ordinal),
        };
    }

    private static IReadOnlyDictionary<ExposureMeasure, double> Frozen(IReadOnlyDictionary<ExposureMeasure, double> figures) =>
        figures as MeasureFigures ?? (IReadOnlyDictionary<ExposureMeasure, double>)new Dictionary<ExposureMeasure, double>(figures);
}
