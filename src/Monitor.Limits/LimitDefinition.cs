using System.Globalization;

namespace Monitor.Limits;

/// <summary>
/// One limit: a measure bounded at a scope, with a warning level and a hysteresis band.
/// Bounds are in the measure's units (money, or money per bp; see <see cref="ExposureMeasure"/>).
/// </summary>
/// <remarks>
/// Bounds straddle zero: <see cref="Upper"/> &gt; 0 bounds long exposure, <see cref="Lower"/> &lt; 0 bounds
/// short exposure; give both for a two-sided limit (signed measures such as DV01 of a book that may
/// be long or short). Utilisation is measured against the bound on the exposure's own side
/// (domain primer, "Limits, as risk officers use them").
/// </remarks>
public sealed record LimitDefinition
{
    /// <summary>Unique id of the limit, used in events and the audit log.</summary>
    public required string Id { get; init; }

    /// <summary>Firm, desk or book, with its id.</summary>
    public required LimitScope Scope { get; init; }

    public required ExposureMeasure Measure { get; init; }

    /// <summary>Bound for negative (short) exposure; negative. Null: short exposure is not limited.</summary>
    public double? Lower { get; init; }

    /// <summary>Bound for positive (long) exposure; positive. Null: long exposure is not limited.</summary>
    public double? Upper { get; init; }

    /// <summary>Utilisation at which the status becomes Warning, in (0, 1]; 0.8 = warn at 80% use (common practice, no source).</summary>
    public double WarningFraction { get; init; } = 0.8;

    /// <summary>
    /// Hysteresis band as a fraction of the limit, in [0, WarningFraction): a status steps down only
    /// once utilisation is below its threshold minus this band. 0.05 = 5% of the limit (common practice, no source).
    /// </summary>
    public double HysteresisFraction { get; init; } = 0.05;

    /// <summary>
    /// Optional filter: the limit bounds only the exposure to bonds of this spread group (sector /
    /// rating bucket) within the scope. Null: all positions.
    /// </summary>
    public string? SpreadGroup { get; init; }

    /// <summary>A temporary limit stops applying at this instant (evaluated against a time passed in). Null: permanent.</summary>
    public DateTimeOffset? ExpiresAt { get; init; }

    /// <summary>True when the limit still applies at <paramref name="asOf"/> (expiry is exclusive: gone at ExpiresAt).</summary>
    public bool IsActiveAt(DateTimeOffset asOf) => ExpiresAt is null || asOf < ExpiresAt.Value;

    /// <summary>
    /// The bound on the exposure's side: Upper for exposure &gt; 0, Lower for exposure &lt; 0; null when that
    /// side is not limited or the exposure is exactly zero.
    /// </summary>
    public double? BoundFor(double exposure) => exposure > 0 ? Upper : exposure < 0 ? Lower : null;

    /// <summary>
    /// Utilisation = exposure / bound on the exposure's side (both have the same sign, so it is &gt;= 0);
    /// 0 when that side is unbounded or the exposure is zero.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">Exposure is NaN or infinite.</exception>
    public double Utilisation(double exposure)
    {
        if (!double.IsFinite(exposure))
        {
            throw new ArgumentOutOfRangeException(nameof(exposure), exposure,
                $"Exposure for limit '{Id}' ({Measure}) must be finite, got {exposure.ToString(CultureInfo.InvariantCulture)}.");
        }

        var bound = BoundFor(exposure);
        return bound is { } b ? exposure / b : 0.0;
    }

    /// <summary>Every problem with this definition; empty when it is usable.</summary>
    public IReadOnlyList<LimitValidationError> Validate()
    {
        var errors = new List<LimitValidationError>();
        var id = Id ?? "";
        void Add(string field, string value, string problem, string fix) => errors.Add(new LimitValidationError(id, field, value, problem, fix));

        if (string.IsNullOrWhiteSpace(Id))
        {
            Add(nameof(Id), Quote(Id), "is empty", "give every limit a unique id such as \"desk-rates-dv01\"");
        }

        if (string.IsNullOrWhiteSpace(Scope.Id))
        {
            Add(nameof(Scope), Quote(Scope.Id), "has no scope id", "name the firm, desk or book the limit applies to");
        }

        if (!Enum.IsDefined(Scope.Level))
        {
            Add(nameof(Scope), Scope.Level.ToString(), "is not a scope level", "use firm, desk or book");
        }

        if (SpreadGroup is not null && string.IsNullOrWhiteSpace(SpreadGroup))
        {
            Add(nameof(SpreadGroup), Quote(SpreadGroup), "is empty", "name a spread group such as \"corp-a\", or leave it out for all positions");
        }

        if (!Enum.IsDefined(Measure))
        {
            Add(nameof(Measure), Measure.ToString(), "is not a measure", "use one of " + string.Join(", ", Enum.GetNames<ExposureMeasure>()));
        }

        if (Lower is null && Upper is null)
        {
            Add(nameof(Upper), "missing", "(and no lower bound either): the limit bounds nothing", "give an upper bound (> 0), a lower bound (< 0) or both");
        }

        if (Upper is { } upper)
        {
            if (!double.IsFinite(upper))
            {
                Add(nameof(Upper), Format(upper), "is not a finite number", "give a positive amount in the measure's units");
            }
            else if (upper <= 0)
            {
                Add(nameof(Upper), Format(upper), "is not above zero: the upper bound limits long (positive) exposure",
                    "give a positive amount; to bound short exposure use a negative lower bound");
            }
        }

        if (Lower is { } lower)
        {
            if (!double.IsFinite(lower))
            {
                Add(nameof(Lower), Format(lower), "is not a finite number", "give a negative amount in the measure's units");
            }
            else if (lower >= 0)
            {
                Add(nameof(Lower), Format(lower), "is not below zero: the lower bound limits short (negative) exposure",
                    "give a negative amount such as " + Format(-Math.Abs(lower == 0 ? 1_000_000 : lower)) + "; to bound long exposure use the upper bound");
            }
        }

        if (Lower is { } lo && Upper is { } up && double.IsFinite(lo) && double.IsFinite(up) && lo >= up)
        {
            Add(nameof(Lower), Format(lo), $"is not below the upper bound {Format(up)}", "make the lower bound smaller than the upper bound");
        }

        if (!double.IsFinite(WarningFraction) || WarningFraction <= 0)
        {
            Add(nameof(WarningFraction), Format(WarningFraction), "is not above 0", "use a fraction of the limit such as 0.8 (warn at 80% use)");
        }
        else if (WarningFraction > 1)
        {
            Add(nameof(WarningFraction), Format(WarningFraction), "is above 1", "use a fraction such as 0.8; the warning level cannot be above the hard limit");
        }

        if (!double.IsFinite(HysteresisFraction) || HysteresisFraction < 0)
        {
            Add(nameof(HysteresisFraction), Format(HysteresisFraction), "is negative", "use a small fraction of the limit such as 0.05, or 0 for none");
        }
        else if (double.IsFinite(WarningFraction) && WarningFraction > 0 && HysteresisFraction >= WarningFraction)
        {
            Add(nameof(HysteresisFraction), Format(HysteresisFraction), $"is not below the warning fraction {Format(WarningFraction)}: a warning could never clear",
                "use a band well below the warning fraction, such as 0.05");
        }

        return errors;
    }

    internal static string Format(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Quote(string? text) => text is null ? "null" : "\"" + text + "\"";
}
