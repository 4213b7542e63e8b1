namespace Monitor.Limits;

/// <summary>
/// The status rule with hysteresis, as a pure function of the previous status and the utilisation.
/// </summary>
/// <remarks>
/// Thresholds: Warning at <c>w</c> = WarningFraction, Breach at 1 (the hard limit). With band <c>h</c>:
/// <list type="bullet">
/// <item>step up as soon as utilisation &gt;= the threshold (no delay on the way up);</item>
/// <item>step down only when utilisation &lt; threshold - h; Breach holds while u &gt;= 1 - h, Warning while u &gt;= w - h.</item>
/// </list>
/// new = max(raw(u), min(previous, held(u))), where raw uses the thresholds and held the lowered ones.
/// The rule is idempotent: evaluating the same utilisation twice changes nothing the second time.
/// Source: domain primer, "Limits, as risk officers use them" (change only on crossing a threshold,
/// clear only after moving back by a margin). Trap: a band of zero lets noise at a threshold flap.
/// </remarks>
public static class LimitEvaluator
{
    /// <summary>The status for utilisation <paramref name="utilisation"/> given the status before it.</summary>
    /// <param name="previous">Status before this utilisation.</param>
    /// <param name="utilisation">Exposure / bound on the side approached (&gt;= 0).</param>
    /// <param name="warningFraction">Warning threshold, in (0, 1].</param>
    /// <param name="hysteresisFraction">Band below each threshold, in [0, warningFraction).</param>
    /// <exception cref="ArgumentOutOfRangeException">Utilisation is NaN (it would silently read as Within).</exception>
    public static LimitStatus Next(LimitStatus previous, double utilisation, double warningFraction, double hysteresisFraction)
    {
        if (previous is not (LimitStatus.Within or LimitStatus.Warning or LimitStatus.Breach))
        {
            throw new ArgumentOutOfRangeException(nameof(previous), previous, "A retired or expired limit is no longer judged.");
        }

        if (double.IsNaN(utilisation))
        {
            throw new ArgumentOutOfRangeException(nameof(utilisation), utilisation, "Utilisation must be a number, got NaN.");
        }

        var raw = Classify(utilisation, warningFraction, 1.0);
        var held = Classify(utilisation, warningFraction - hysteresisFraction, 1.0 - hysteresisFraction);
        var kept = (LimitStatus)Math.Min((int)previous, (int)held);
        return (LimitStatus)Math.Max((int)raw, (int)kept);
    }

    /// <summary>Applies <see cref="Next(LimitStatus, double, double, double)"/> with the limit's thresholds to an exposure.</summary>
    /// <returns>The change, or null when the status is unchanged.</returns>
    public static LimitStatusChange? Evaluate(LimitDefinition limit, LimitStatus previous, double exposure)
    {
        ArgumentNullException.ThrowIfNull(limit);
        var utilisation = limit.Utilisation(exposure);
        var current = Next(previous, utilisation, limit.WarningFraction, limit.HysteresisFraction);
        if (current == previous)
        {
            return null;
        }

        return new LimitStatusChange(limit.Id, limit.Scope, limit.Measure, previous, current, exposure,
            limit.BoundFor(exposure) ?? limit.Upper ?? limit.Lower ?? 0.0, utilisation);
    }

    /// <summary>
    /// The last change of a limit that leaves the set (<paramref name="end"/> is <see cref="LimitStatus.Retired"/> or
    /// <see cref="LimitStatus.Expired"/>), on the scope's exposure at that moment, so its last standing is on record.
    /// </summary>
    public static LimitStatusChange End(LimitDefinition limit, LimitStatus previous, double exposure, LimitStatus end)
    {
        ArgumentNullException.ThrowIfNull(limit);
        if (end is not (LimitStatus.Retired or LimitStatus.Expired))
        {
            throw new ArgumentOutOfRangeException(nameof(end), end, "A limit ends as Retired or Expired.");
        }

        return new LimitStatusChange(limit.Id, limit.Scope, limit.Measure, previous, end, exposure,
            limit.BoundFor(exposure) ?? limit.Upper ?? limit.Lower ?? 0.0, limit.Utilisation(exposure));
    }

    private static LimitStatus Classify(double utilisation, double warningAt, double breachAt) =>
        utilisation >= breachAt ? LimitStatus.Breach
        : utilisation >= warningAt ? LimitStatus.Warning
        : LimitStatus.Within;
}
