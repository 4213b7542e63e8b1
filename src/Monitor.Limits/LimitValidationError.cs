namespace Monitor.Limits;

/// <summary>
/// One problem with a limit definition: the field (C# property name of <see cref="LimitDefinition"/>),
/// the offending value as text (invariant culture), what is wrong and how to fix it.
/// </summary>
public sealed record LimitValidationError(string LimitId, string Field, string Value, string Problem, string Fix)
{
    /// <summary>"limit 'x' WarningFraction: 1.2 is above 1; use a fraction such as 0.8".</summary>
    public override string ToString() => $"limit '{LimitId}' {Field}: {Value} {Problem}; {Fix}";
}
