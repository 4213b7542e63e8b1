namespace Monitor.Service.Engine;

/// <summary>A validated trade message. Record equality compares the whole payload (used to tell a redelivery from a conflict).</summary>
public sealed record TradeInput(
    string TradeId,
    int Version,
    TradeAction Action,
    string Book,
    string InstrumentId,
    double FaceAmount,
    double CleanPrice,
    DateTimeOffset TradeTime);
