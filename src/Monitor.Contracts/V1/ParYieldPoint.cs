namespace Monitor.Contracts.V1;

/// <summary>One tenor of a par-yield curve: tenor as "1M", "3M", "6M", "1Y", "2Y", ... "30Y"; par yield as a decimal.</summary>
public sealed record ParYieldPoint
{
    public required string Tenor { get; init; }

    public required double ParYield { get; init; }
}
