namespace Monitor.Limits;

/// <summary>A limit whose id stayed while its definition changed on reload.</summary>
public sealed record LimitModification(LimitDefinition Before, LimitDefinition After);
