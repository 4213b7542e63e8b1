namespace Monitor.Service.Engine;

/// <summary>What happened to a trade message.</summary>
public enum TradeOutcome
{
    /// <summary>The trade changed the book's position.</summary>
    Applied,

    /// <summary>The same id, version and payload was applied before (a redelivery): nothing changed.</summary>
    Duplicate,

    /// <summary>An older version than the one applied: recorded and ignored.</summary>
    Superseded,
}
