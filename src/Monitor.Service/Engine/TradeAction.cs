namespace Monitor.Service.Engine;

/// <summary>What a trade message does: books a new trade, amends it, or cancels it.</summary>
public enum TradeAction
{
    New,
    Amend,
    Cancel,
}
