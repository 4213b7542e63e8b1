namespace Monitor.Contracts.V1;

/// <summary>
/// Inbound: a trade, its amendment or its cancellation. A trade is identified by
/// <see cref="TradeId"/>; each amendment or cancellation carries the next <see cref="Version"/>.
/// Wire identity: <c>Monitor.Contracts.V1.TradeBooked</c>.
/// </summary>
public sealed record TradeBooked
{
    public required string TradeId { get; init; }

    /// <summary>1 for a new trade, +1 for each amendment or cancellation.</summary>
    public required int Version { get; init; }

    /// <summary>"new", "amend" or "cancel".</summary>
    public required string Action { get; init; }

    public required string Book { get; init; }

    public required string InstrumentId { get; init; }

    /// <summary>Signed face amount in the bond's currency: positive bought, negative sold.</summary>
    public required double FaceAmount { get; init; }

    /// <summary>Clean price per 100 face.</summary>
    public required double CleanPrice { get; init; }

    public required DateTimeOffset TradeTime { get; init; }
}
